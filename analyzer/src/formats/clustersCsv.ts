/**
 * The clusters table as CSV
 * =========================
 * One row per cluster of one level, in snapshot order, with a header row: the cluster's id,
 * level, number of member modules, P, ΣV, Σ decisions, internal and external edge weight, and
 * the member module ids joined with "; ". A snapshot without clusters gives the header alone.
 *
 * [Reference]: RFC 4180.
 */
import type { ClusterRecord, ModuleLevel } from '../model/ModuleMap';
import type { Snapshot } from '../model/Snapshot';
import { csvRow } from './csvCell';

const COLUMNS: [string, (c: ClusterRecord) => string | number][] = [
  ['id', (c) => c.id],
  ['level', (c) => c.level],
  ['modules', (c) => c.members.length],
  ['functions', (c) => c.functions],
  ['cyclomatic', (c) => c.cyclomatic],
  ['decisions', (c) => c.decisions],
  ['internalWeight', (c) => c.internalWeight],
  ['externalWeight', (c) => c.externalWeight],
  ['members', (c) => c.members.join('; ')],
];

/** The clusters of `level` as CSV text, one chunk per row (CRLF line ends). */
export function* clustersCsv(snapshot: Snapshot, level: ModuleLevel): Generator<string> {
  yield csvRow(COLUMNS.map(([name]) => name));
  for (const c of snapshot.clusters ?? []) if (c.level === level) yield csvRow(COLUMNS.map(([, value]) => value(c)));
}
