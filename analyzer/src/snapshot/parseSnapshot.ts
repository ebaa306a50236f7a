/**
 * Parse a snapshot text
 * =====================
 * Turns the text of a snapshot file into a `Snapshot`, or throws a `SnapshotInputError` that
 * names the source and says what is wrong: not JSON (with line and column), a different schema
 * version, the first schema problems (`/functions/3/cyclomatic: must be integer`), or two
 * functions sharing an id (comparisons against a baseline match functions by id).
 *
 * [Reference]: docs/snapshot.schema.json; ECMA-404 for the JSON syntax.
 */
import { SNAPSHOT_SCHEMA } from '../model/Snapshot';
import type { Snapshot } from '../model/Snapshot';
import { SnapshotInputError } from './SnapshotInputError';
import { snapshotSchemaProblems } from './validateSnapshot';
import type { SnapshotProblem } from './validateSnapshot';

/** How many problems an error message lists before "… and N more". */
export const PROBLEMS_SHOWN = 5;

function lineAndColumn(text: string, offset: number): string {
  let line = 1;
  let lineStart = 0;
  for (let i = 0; i < offset && i < text.length; i++) {
    if (text.charCodeAt(i) === 10) {
      line++;
      lineStart = i + 1;
    }
  }
  return `line ${line}, column ${offset - lineStart + 1}`;
}

function parseJson(text: string, source: string): unknown {
  try {
    return JSON.parse(text);
  } catch (error) {
    const detail = (error as Error).message;
    const at = /position (\d+)/.exec(detail);
    const where = at ? ` at ${lineAndColumn(text, Number(at[1]))}` : '';
    const why = text.trim() === '' ? 'the file is empty' : detail
      .replace(/ in JSON at position \d+.*$/s, '')
      .replace(/, ".*" is not valid JSON$/s, '');
    throw new SnapshotInputError(`${source} is not valid JSON${where}: ${why}`);
  }
}

function duplicateIds(value: Snapshot): SnapshotProblem[] {
  const firstIndex = new Map<string, number>();
  const problems: SnapshotProblem[] = [];
  value.functions.forEach((fn, index) => {
    const first = firstIndex.get(fn.id);
    if (first === undefined) firstIndex.set(fn.id, index);
    else problems.push({ path: `/functions/${index}/id`, message: `duplicate of /functions/${first}/id ('${fn.id}')` });
  });
  return problems;
}

/** Lines `  /path: problem` for the first problems, then how many were left out. */
export function formatProblems(problems: readonly SnapshotProblem[], shown = PROBLEMS_SHOWN): string {
  const lines = problems.slice(0, shown).map((p) => `  ${p.path === '' ? '(top level)' : p.path}: ${p.message}`);
  if (problems.length > shown) lines.push(`  … and ${problems.length - shown} more`);
  return lines.join('\n');
}

/** Parse and validate a snapshot text; `source` names it in errors (a file name). */
export function parseSnapshot(text: string, source: string): Snapshot {
  const value = parseJson(text, source);
  if (typeof value !== 'object' || value === null || Array.isArray(value) || !('schema' in value)) {
    throw new SnapshotInputError(`${source} is not a Seamline snapshot (no "schema": "${SNAPSHOT_SCHEMA}" at the top level)`);
  }
  const schema = (value as { schema: unknown }).schema;
  if (schema !== SNAPSHOT_SCHEMA) {
    throw new SnapshotInputError(
      `${source} is a ${JSON.stringify(schema)} file; this version of Seamline reads "${SNAPSHOT_SCHEMA}"`,
    );
  }
  const problems = snapshotSchemaProblems(value);
  if (problems.length === 0) problems.push(...duplicateIds(value as Snapshot));
  if (problems.length > 0) {
    const count = problems.length === 1 ? '1 problem' : `${problems.length} problems`;
    throw new SnapshotInputError(
      `${source} does not match the snapshot schema (${count}):\n${formatProblems(problems)}`,
      problems,
    );
  }
  return value as Snapshot;
}
