/**
 * The functions table as CSV
 * ==========================
 * One row per function of a snapshot, in snapshot order, with a header row. Coverage columns are
 * added when the snapshot carries an imported coverage report (empty cells for functions the
 * report did not reach). `overLimit` compares the reported V(G) with the snapshot's limit.
 *
 * [Reference]: RFC 4180.
 */
import type { FunctionRecord } from '../model/FunctionRecord';
import type { Snapshot } from '../model/Snapshot';
import { csvRow } from './csvCell';

type Cell = string | number | boolean | undefined;

const BASE_COLUMNS: [string, (fn: FunctionRecord, limit: number) => Cell][] = [
  ['id', (fn) => fn.id],
  ['file', (fn) => fn.file],
  ['qualifiedName', (fn) => fn.qualifiedName],
  ['kind', (fn) => fn.kind],
  ['line', (fn) => fn.line],
  ['endLine', (fn) => fn.endLine],
  ['loc', (fn) => fn.loc],
  ['cyclomatic', (fn) => fn.cyclomatic],
  ['cyclomaticStrict', (fn) => fn.cyclomaticStrict],
  ['decisions', (fn) => fn.decisions],
  ['essential', (fn) => fn.essential],
  ['nodes', (fn) => fn.nodes],
  ['edges', (fn) => fn.edges],
  ['overLimit', (fn, limit) => fn.cyclomatic > limit],
];

const COVERAGE_COLUMNS: [string, (fn: FunctionRecord) => Cell][] = [
  ['outcomesCovered', (fn) => fn.coverage?.outcomesCovered],
  ['outcomesTotal', (fn) => fn.coverage?.outcomesTotal],
  ['actualComplexity', (fn) => fn.coverage?.actualComplexity],
  ['untestedPaths', (fn) => fn.coverage?.untestedPaths],
  ['crap', (fn) => fn.coverage?.crap],
];

/** The column names, in order, for this snapshot. */
export function functionsCsvColumns(snapshot: Snapshot): string[] {
  const withCoverage = hasCoverage(snapshot);
  return [...BASE_COLUMNS, ...(withCoverage ? COVERAGE_COLUMNS : [])].map(([name]) => name);
}

function hasCoverage(snapshot: Snapshot): boolean {
  return snapshot.coverage !== undefined || snapshot.functions.some((fn) => fn.coverage !== undefined);
}

/** The functions table as CSV text, one chunk per row (CRLF line ends). */
export function* functionsCsv(snapshot: Snapshot): Generator<string> {
  const limit = snapshot.settings.limit;
  const withCoverage = hasCoverage(snapshot);
  yield csvRow(functionsCsvColumns(snapshot));
  for (const fn of snapshot.functions) {
    const cells: Cell[] = BASE_COLUMNS.map(([, cell]) => cell(fn, limit));
    if (withCoverage) cells.push(...COVERAGE_COLUMNS.map(([, cell]) => cell(fn)));
    yield csvRow(cells);
  }
}
