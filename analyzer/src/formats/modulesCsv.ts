/**
 * The modules table as CSV
 * ========================
 * One row per module of one level (file, folder or package), in snapshot order, with a header
 * row and every field of the module record; a gravity score's reasons are joined with "; ",
 * and null values (instability of an uncoupled module, abstractness without classes, no
 * cluster) are empty cells. A snapshot without a module map gives the header alone.
 * `MODULE_COLUMNS` is shared with the GraphML export, which types each column for its keys.
 *
 * [Reference]: RFC 4180.
 */
import type { ModuleLevel, ModuleRecord } from '../model/ModuleMap';
import type { Snapshot } from '../model/Snapshot';
import { csvRow } from './csvCell';

/** GraphML attribute types (graphml.graphdrawing.org) of the module columns. */
export type ColumnType = 'string' | 'int' | 'double';

/** A module record field: its name, its type, and its value (null or undefined: none). */
export type ModuleColumn = [string, ColumnType, (m: ModuleRecord) => string | number | null | undefined];

/** Every field of a module record, in the order of the model. */
export const MODULE_COLUMNS: readonly ModuleColumn[] = [
  ['id', 'string', (m) => m.id],
  ['path', 'string', (m) => m.path],
  ['level', 'string', (m) => m.level],
  ['name', 'string', (m) => m.name],
  ['functions', 'int', (m) => m.functions],
  ['cyclomatic', 'int', (m) => m.cyclomatic],
  ['decisions', 'int', (m) => m.decisions],
  ['nodes', 'int', (m) => m.nodes],
  ['edges', 'int', (m) => m.edges],
  ['maxCyclomatic', 'int', (m) => m.maxCyclomatic],
  ['overLimit', 'int', (m) => m.overLimit],
  ['lines', 'int', (m) => m.lines],
  ['fanIn', 'int', (m) => m.fanIn],
  ['fanOut', 'int', (m) => m.fanOut],
  ['ca', 'int', (m) => m.ca],
  ['ce', 'int', (m) => m.ce],
  ['instability', 'double', (m) => m.instability],
  ['abstractness', 'double', (m) => m.abstractness],
  ['designComplexity', 'int', (m) => m.designComplexity],
  ['integrationComplexity', 'int', (m) => m.integrationComplexity],
  ['unresolvedCalls', 'int', (m) => m.unresolvedCalls],
  ['externalCalls', 'int', (m) => m.externalCalls],
  ['cluster', 'string', (m) => m.cluster],
  ['gravity', 'double', (m) => m.gravity],
  ['gravityRank', 'int', (m) => m.gravityRank],
  ['reasons', 'string', (m) => m.reasons.join('; ')],
];

/** The modules of `level` as CSV text, one chunk per row (CRLF line ends). */
export function* modulesCsv(snapshot: Snapshot, level: ModuleLevel): Generator<string> {
  yield csvRow(MODULE_COLUMNS.map(([name]) => name));
  for (const m of snapshot.modules ?? []) if (m.level === level) yield csvRow(MODULE_COLUMNS.map(([, , value]) => value(m)));
}
