/**
 * Call nodes of a flow graph
 * ==========================
 * Maps call sites (1-based line and column of the call expression's first character, as the
 * call-graph pass reports them) to the blocks that hold them: the block with the innermost
 * span containing the position. Spans nest where an operator splits a statement (`x = a && f()`:
 * the statement's block spans the whole line, the block of `f()` only the call), so the
 * innermost one is the block where the call runs. A site no block contains (a default value
 * when default values are not modelled, or a position from another unit) names no block.
 *
 * [Reference]: McCabe & Butler 1989, CACM 32(12): a module's call nodes are the blocks that
 * call subordinate modules.
 */
import type { FlowGraph, SourceSpan } from '../model';

/** A position in the source: 1-based line and column. */
export interface CallPosition {
  line: number;
  column: number;
}

/** The ids of the blocks holding the given call sites. */
export function callBlocksOf(graph: FlowGraph, callSites: readonly CallPosition[]): Set<number> {
  const blocks = new Set<number>();
  // NOTE: sites × blocks is small per function (a few hundred comparisons); no index needed.
  for (const site of callSites) {
    let best: { id: number; span: SourceSpan } | undefined;
    for (const block of graph.blocks) {
      const span = block.span;
      if (!span || !contains(span, site)) continue;
      if (!best || isInside(span, best.span)) best = { id: block.id, span };
    }
    if (best) blocks.add(best.id);
  }
  return blocks;
}

function compare(line: number, column: number, otherLine: number, otherColumn: number): number {
  return line !== otherLine ? line - otherLine : column - otherColumn;
}

// Spans have an exclusive end (the position just after the last character).
function contains(span: SourceSpan, p: CallPosition): boolean {
  return compare(span.line, span.column, p.line, p.column) <= 0 && compare(p.line, p.column, span.endLine, span.endColumn) < 0;
}

/** `a` starts later than `b`, or starts with it and ends sooner: the inner of two nested spans. */
function isInside(a: SourceSpan, b: SourceSpan): boolean {
  const start = compare(a.line, a.column, b.line, b.column);
  return start > 0 || (start === 0 && compare(a.endLine, a.endColumn, b.endLine, b.endColumn) < 0);
}
