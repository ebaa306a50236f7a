import { decisionSummary } from './decision-wording';
import { edgeCoverage } from './path-highlight';
import type { BasisPath, FunctionDetail, SeverityBand } from './flow-types';
import { layoutFlowGraph, type FlowLayout } from './flow-layout';
import { firstColumnOf, sourceLines, type SourceLine } from './source-lines';

/** Graphs with more blocks than this are not drawn (the layout would take too long in a browser). */
export const MAX_DRAWN_BLOCKS = 2500;

/** The published V(G) ranges of our band names. */
export const BAND_RANGES: Record<SeverityBand, string> = {
  calm: '1–10',
  busy: '11–20',
  tangled: '21–50',
  knotted: 'over 50',
};

/** Everything the Flow screen derives once from a loaded function. */
export interface FlowView {
  detail: FunctionDetail;
  /** The drawn graph, or null when it is too large to draw. */
  layout: FlowLayout | null;
  /** Per edge: covered (true/false) or not an outcome / no coverage (null). */
  edgeCoverage: (boolean | null)[];
  /** Source lines with decision runs, or null without source. */
  lines: SourceLine[] | null;
  /** The decisions that keep ev(G) above 1, as readable lines. */
  irreducible: { decision: number; summary: string }[];
  /** Why fewer basis paths than V(G) exist, one sentence per reason. */
  gapNotes: string[];
  /** "V − AC = 41 − 6 = 35" when the numbers agree, else null. */
  untestedFormula: string | null;
}

/** Derives the drawn graph, the source lines and the explanations from a function's detail. */
export function flowView(detail: FunctionDetail): FlowView {
  const { graph, function: fn, coverage } = detail;
  const layout = graph.blocks.length <= MAX_DRAWN_BLOCKS ? layoutFlowGraph(graph) : null;
  const lines =
    detail.source === null
      ? null
      : sourceLines(detail.source, fn.line, firstColumnOf(detail.source, fn.line, graph.decisions), graph.decisions);
  const irreducible = detail.essential.irreducibleDecisions
    .filter((d) => graph.decisions[d])
    .map((decision) => ({ decision, summary: decisionSummary(graph.decisions[decision]) }));
  let untestedFormula: string | null = null;
  if (coverage) {
    const v = [fn.cyclomaticStrict, fn.cyclomatic].find((value) => value - coverage.actualComplexity === coverage.untestedPaths);
    if (v !== undefined) untestedFormula = `V − AC = ${v} − ${coverage.actualComplexity} = ${coverage.untestedPaths}`;
  }
  return {
    detail,
    layout,
    edgeCoverage: edgeCoverage(graph, coverage),
    lines,
    irreducible,
    gapNotes: gapNotes(detail),
    untestedFormula,
  };
}

/** Sentences explaining decisions and outcomes no entry-to-exit path can take. */
export function gapNotes(detail: FunctionDetail): string[] {
  const { gaps, graph } = detail;
  const line = (d: number) => graph.decisions[d]?.span.line ?? '?';
  const notes: string[] = [];
  if (!gaps.exitReachable) notes.push('No path leads from the entry to the exit: the function never returns, whatever it decides.');
  if (gaps.unreachableDecisions.length > 0) {
    notes.push(`Decisions in dead code (never reached) on line ${gaps.unreachableDecisions.map(line).join(', ')}.`);
  }
  if (gaps.trappedDecisions.length > 0) {
    notes.push(`Decisions from which the exit cannot be reached (inside an endless loop) on line ${gaps.trappedDecisions.map(line).join(', ')}.`);
  }
  for (const o of gaps.trappedOutcomes) {
    notes.push(`The ${o.outcome} outcome of the decision on line ${line(o.decision)} never reaches the exit.`);
  }
  return notes;
}

/** The path's label in the list: "Path 1 (baseline)", "Path 2", … */
export function pathLabel(path: BasisPath): string {
  return path.index === 0 ? 'Path 1 (baseline)' : `Path ${path.index + 1}`;
}
