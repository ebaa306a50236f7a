/**
 * Control-flow graph of one function unit
 * =======================================
 * Basic blocks joined by edges. Every decision is binary: its block has exactly two outgoing
 * edges, labelled `true` and `false` (a `case` test is "matches / does not match", a loop test
 * "enter body / leave", a `catch` "the try block throws / completes"). Every other block except
 * the exit has exactly one outgoing edge. Hence V(G) = E − N + 2P = decisions + 1 for P = 1.
 * Parallel edges are allowed (an empty `then` branch), so edges are identified by their index.
 */

/** A place in the source: 1-based lines and 1-based columns. */
export interface SourceSpan {
  line: number;
  column: number;
  endLine: number;
  endColumn: number;
}

/** Every construct that can be a decision (some only under a counting setting). */
export type DecisionKind =
  | 'if'
  | 'conditional'
  | 'case'
  | 'for'
  | 'for-in'
  | 'for-of'
  | 'while'
  | 'do-while'
  | 'catch'
  | 'and'
  | 'or'
  | 'nullish'
  | 'and-assign'
  | 'or-assign'
  | 'nullish-assign'
  | 'optional-chain'
  | 'default-value';

export const DECISION_KINDS: readonly DecisionKind[] = [
  'if', 'conditional', 'case', 'for', 'for-in', 'for-of', 'while', 'do-while', 'catch',
  'and', 'or', 'nullish', 'and-assign', 'or-assign', 'nullish-assign', 'optional-chain', 'default-value',
];

export type BlockKind = 'entry' | 'exit' | 'code' | 'decision';

export interface BasicBlock {
  id: number;
  kind: BlockKind;
  /** Source covered by the block's statements or condition; absent for entry, exit and empty joins. */
  span?: SourceSpan;
}

export type Outcome = 'true' | 'false';

export interface FlowEdge {
  from: number;
  to: number;
  /** Set on the two edges leaving a decision block. */
  decision?: number;
  outcome?: Outcome;
}

export interface Decision {
  id: number;
  kind: DecisionKind;
  /** The block whose two outgoing edges are this decision's outcomes. */
  block: number;
  /** Where the condition (or case label, loop head, operator's left operand) is. */
  span: SourceSpan;
  /** The condition's source text, whitespace collapsed, at most 120 characters. */
  text: string;
  /** For `case` decisions: which switch statement (0, 1, … in source order) they belong to. */
  switchIndex?: number;
}

export interface FlowGraph {
  blocks: BasicBlock[];
  edges: FlowEdge[];
  decisions: Decision[];
  entry: number;
  exit: number;
}
