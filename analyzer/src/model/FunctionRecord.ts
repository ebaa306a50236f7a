import type { DecisionKind, SourceSpan } from './FlowGraph';

/** What kind of syntax a function unit is. */
export type FunctionKind =
  | 'function'
  | 'method'
  | 'arrow'
  | 'constructor'
  | 'getter'
  | 'setter'
  | 'static-block'
  | 'field-initializer'
  | 'top-level';

/**
 * The stored form of a flow graph: blocks as spans (null for entry, exit and empty joins),
 * edges as `[from, to]` or `[from, to, decision, outcome]` with outcome 1 = true, 0 = false.
 */
export interface CompactGraph {
  entry: number;
  exit: number;
  blocks: (([number, number, number, number]) | null)[];
  edges: ([number, number] | [number, number, number, 0 | 1])[];
  decisions: { kind: DecisionKind; block: number; span: SourceSpan; text: string; switchIndex?: number }[];
}

/** One function unit's metrics, as `functions[]` of a snapshot carries them. */
export interface FunctionRecord {
  /** Stable across snapshots while the code does not move: file, qualified name and ordinal. */
  id: string;
  name: string;
  qualifiedName: string;
  kind: FunctionKind;
  /** Posix path relative to the scanned root. */
  file: string;
  /** 1-based lines of the node's first and last character (decorators and comments excluded). */
  line: number;
  endLine: number;
  /** Lines of code: lines holding at least one token of the unit (comments and blank lines excluded). */
  loc: number;
  /** V(G) as reported under the counting settings (`--switch one` subtracts cases − 1 per switch). */
  cyclomatic: number;
  /** E − N + 2P of the graph itself. */
  cyclomaticStrict: number;
  /** Decisions counted on the syntax tree (independently of the graph). */
  decisions: number;
  nodes: number;
  edges: number;
  /** ev(G), essential complexity. */
  essential: number;
  /** Hash of the normalised body: whitespace, comments and local names ignored. */
  fingerprint: string;
  /** Calls the type checker could not resolve (filled by the call-graph pass; 0 without it). */
  unresolvedCalls: number;
  /** Calls into external packages (filled by the call-graph pass; 0 without it). */
  externalCalls: number;
  /** iv(G), module design complexity: V of the graph reduced to the decisions that control calls (with the call graph). */
  designComplexity?: number;
  graph: CompactGraph;
  /** The unit's source text, only with `--embed-source`. */
  source?: string;
  /** Present when a coverage report was imported for this snapshot. */
  coverage?: FunctionCoverage;
}

/** A function's coverage mapped onto its decisions (see docs/metrics/coverage.md). */
export interface FunctionCoverage {
  /** Decision outcomes the report counts > 0, out of 2 × decisions. */
  outcomesCovered: number;
  outcomesTotal: number;
  /** Per decision (same order as graph.decisions): [true covered, false covered]. */
  outcomes: [boolean, boolean][];
  /** AC: the cyclomatic number of the subgraph of covered edges. */
  actualComplexity: number;
  /** V − AC. */
  untestedPaths: number;
  /** CRAP with coverage = covered outcomes / all outcomes. */
  crap: number;
}
