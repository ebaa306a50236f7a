/**
 * A unit's coverage
 * =================
 * Puts the coverage rules together for one function unit: whether it ran (its function's
 * call count, else its lines), which decision outcomes ran (`coveredOutcomes`), the actual
 * complexity AC of the covered subgraph, the untested paths V − AC with V = E − N + 2 of the
 * graph, and CRAP with coverage = covered outcomes / all outcomes. A unit without decisions
 * counts as fully covered when it ran and as uncovered when it did not.
 *
 * [Reference]: McCabe 1976 (IEEE TSE SE-2(4)); Savoia 2007 (CRAP, Artima blog).
 */
import type { FlowGraph, FunctionCoverage, FunctionKind } from '../model';
import { actualComplexity } from './actualComplexity';
import type { FileCoverage } from './CoverageReport';
import { coveredOutcomes } from './coveredOutcomes';
import { crap } from './crap';
import { type LineRange, UnitHits } from './UnitHits';

/** One function unit as the coverage import needs it. */
export interface CoverageUnit {
  graph: FlowGraph;
  kind: FunctionKind;
  /** First and last line of the unit (FunctionRecord.line / endLine). */
  line: number;
  endLine: number;
  /** Line ranges of the units directly or indirectly nested in this one. */
  nested?: readonly LineRange[];
}

/** Maps a file's coverage onto one of its units. */
export function applyCoverage(unit: CoverageUnit, file: FileCoverage): FunctionCoverage {
  const hits = new UnitHits(unit.graph, file, { line: unit.line, endLine: unit.endLine }, unit.nested);
  const calls = unit.kind === 'top-level' ? undefined : file.functions.find((f) => f.line === unit.line)?.calls;
  const ran = calls !== undefined ? calls > 0 : unitRan(hits, unit.kind);
  const outcomes = coveredOutcomes(hits, ran, calls);
  const outcomesTotal = 2 * outcomes.length;
  const outcomesCovered = outcomes.reduce((n, [t, f]) => n + (t ? 1 : 0) + (f ? 1 : 0), 0);
  const v = unit.graph.edges.length - unit.graph.blocks.length + 2;
  const ac = actualComplexity(unit.graph, outcomes, ran);
  const fraction = outcomesTotal > 0 ? outcomesCovered / outcomesTotal : ran ? 1 : 0;
  return {
    outcomesCovered,
    outcomesTotal,
    outcomes,
    actualComplexity: ac,
    untestedPaths: v - ac,
    crap: crap(v, fraction),
  };
}

function unitRan(hits: UnitHits, kind: FunctionKind): boolean {
  if (kind === 'top-level') return hits.anyLineRan();
  const first = hits.reach(hits.graph.entry);
  return typeof first === 'object' ? first.hits > 0 : hits.anyLineRan();
}
