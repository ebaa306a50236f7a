/**
 * Graph writer
 * ============
 * Appends blocks, edges and decisions while the builder walks a unit. Control "in flight" is a
 * frontier: either one open code block that still takes statements, or a list of pending
 * edges (created with an unknown target) that the next block receives. A join is just such a
 * list, so empty join blocks are never created: an `if` without `else` leaves the decision's
 * false edge pending and the next statement's block receives it together with the then-branch.
 * An empty frontier means dead code; the next block is still built, with no predecessor, and
 * flows on normally (dead code stays in the graph).
 *
 * Decisions are numbered in source order when the graph is finished (by span start, then span
 * end, then creation), so equal code gives equal decision ids.
 */
import type { ts } from '../compiler';
import type { BasicBlock, BlockKind, Decision, DecisionKind, FlowEdge, FlowGraph, Outcome } from '../model/FlowGraph';
import { FlowGraphError } from './FlowGraphError';
import { spanOf } from './sourceSpan';

interface DecisionDraft {
  kind: DecisionKind;
  start: number;
  end: number;
  text: string;
  switchIndex: number;
  block: number;
}

/** Edge whose target is not known yet. */
const PENDING = -1;

export class GraphWriter {
  /** The entry block's id (always 0). */
  readonly entry: number;
  private readonly kinds: BlockKind[] = [];
  private readonly starts: number[] = [];
  private readonly ends: number[] = [];
  private readonly edges: FlowEdge[] = [];
  private readonly drafts: DecisionDraft[] = [];
  private open = -1;
  private front: number[] = [];

  constructor(private readonly sourceFile: ts.SourceFile) {
    this.entry = this.newBlock('entry');
    this.front.push(this.pendingEdge(this.entry));
  }

  /** Whether control can reach the current point (false in dead code). */
  get isLive(): boolean {
    return this.open >= 0 || this.front.length > 0;
  }

  /** Adds source `[start, end)` to the open code block, starting a new block if none is open. */
  emit(start: number, end: number): void {
    if (this.open < 0) this.openBlock();
    const b = this.open;
    if (this.starts[b] < 0 || start < this.starts[b]) this.starts[b] = start;
    if (end > this.ends[b]) this.ends[b] = end;
  }

  /** Adds a node's source (without leading trivia) to the open code block. */
  emitNode(node: ts.Node): void {
    this.emit(node.getStart(this.sourceFile), node.end);
  }

  /** Starts a new (possibly empty) code block that receives the frontier; used as a loop's back-edge target. */
  openBlock(): number {
    const b = this.newBlock('code');
    this.enter(b);
    this.open = b;
    return b;
  }

  /** Closes the open block: its single out-edge becomes a pending edge of the frontier. */
  seal(): void {
    if (this.open >= 0) {
      this.front.push(this.pendingEdge(this.open));
      this.open = -1;
    }
  }

  /** The id the next block will get, after sealing: the head of a loop built next. */
  mark(): number {
    this.seal();
    return this.kinds.length;
  }

  /** Removes and returns the frontier's pending edges (control is then dead until `merge`). */
  take(): number[] {
    this.seal();
    const front = this.front;
    this.front = [];
    return front;
  }

  /** Adds pending edges to the frontier (a join). */
  merge(edges: readonly number[]): void {
    this.seal();
    for (const e of edges) this.front.push(e);
  }

  /** Points pending edges at an existing block (a back edge). */
  connect(edges: readonly number[], block: number): void {
    for (const e of edges) this.edges[e].to = block;
  }

  /** Registers a decision; its block is set by `decide`. Returns the draft id. */
  addDecision(kind: DecisionKind, start: number, end: number, text: string, switchIndex = -1): number {
    this.drafts.push({ kind, start, end, text, switchIndex, block: -1 });
    return this.drafts.length - 1;
  }

  /**
   * Creates the decision block testing `[start, end)`: it receives the frontier, and its two
   * edges go to `onTrue` (tested value truthy) and `onFalse`. With `negated` the labels swap:
   * the decision's own `true` outcome is then the tested value being falsy.
   */
  decide(decision: number, start: number, end: number, onTrue: number[], onFalse: number[], negated = false): number {
    const draft = this.drafts[decision];
    if (draft.block >= 0) throw new FlowGraphError(`decision ${decision} already has block ${draft.block}`);
    const b = this.newBlock('decision');
    this.starts[b] = start;
    this.ends[b] = end;
    this.enter(b);
    draft.block = b;
    const t = this.labelledEdge(b, decision, 'true');
    const f = this.labelledEdge(b, decision, 'false');
    (negated ? onFalse : onTrue).push(t);
    (negated ? onTrue : onFalse).push(f);
    return b;
  }

  /** Ends the graph: the frontier and `exitEdges` go to a new exit block; decisions are numbered in source order. */
  finish(exitEdges: readonly number[]): FlowGraph {
    this.merge(exitEdges);
    const exit = this.newBlock('exit');
    this.enter(exit);
    const order = this.drafts.map((_, i) => i);
    order.sort((a, b) => this.drafts[a].start - this.drafts[b].start || this.drafts[a].end - this.drafts[b].end || a - b);
    const renumber = new Array<number>(order.length);
    const decisions: Decision[] = order.map((draftId, id) => {
      renumber[draftId] = id;
      const d = this.drafts[draftId];
      if (d.block < 0) throw new FlowGraphError(`decision "${d.text}" has no block`);
      const decision: Decision = { id, kind: d.kind, block: d.block, span: spanOf(this.sourceFile, d.start, d.end), text: d.text };
      if (d.switchIndex >= 0) decision.switchIndex = d.switchIndex;
      return decision;
    });
    for (const edge of this.edges) {
      if (edge.to === PENDING) throw new FlowGraphError(`edge from block ${edge.from} has no target`);
      if (edge.decision !== undefined) edge.decision = renumber[edge.decision];
    }
    const blocks: BasicBlock[] = this.kinds.map((kind, id) => {
      const block: BasicBlock = { id, kind };
      if (this.starts[id] >= 0) block.span = spanOf(this.sourceFile, this.starts[id], this.ends[id]);
      return block;
    });
    return { blocks, edges: this.edges, decisions, entry: this.entry, exit };
  }

  private newBlock(kind: BlockKind): number {
    this.kinds.push(kind);
    this.starts.push(-1);
    this.ends.push(-1);
    return this.kinds.length - 1;
  }

  /** Makes `block` the target of the whole frontier. */
  private enter(block: number): void {
    this.seal();
    for (const e of this.front) this.edges[e].to = block;
    this.front = [];
  }

  private pendingEdge(from: number): number {
    return this.edges.push({ from, to: PENDING }) - 1;
  }

  private labelledEdge(from: number, decision: number, outcome: Outcome): number {
    return this.edges.push({ from, to: PENDING, decision, outcome }) - 1;
  }
}
