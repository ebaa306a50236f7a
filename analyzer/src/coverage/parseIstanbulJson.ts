/**
 * Reading Istanbul JSON
 * =====================
 * Parses Istanbul's coverage JSON (`coverage-final.json`: file path → `{ path, statementMap,
 * s, fnMap, f, branchMap, b }`, optionally wrapped as `{ data: … }`) into the normalised
 * `CoverageReport`. Line hits are derived the way Istanbul's own lcov writer derives `DA`: per
 * line, the largest count of the statements starting there. Branch records keep Istanbul's
 * `type` and where each outcome starts; columns become 1-based. The key order of `branchMap`
 * is the instrumenter's walk order, which the mapping relies on.
 *
 * [Reference]: istanbul-lib-coverage `FileCoverage` (getLineCoverage) and istanbul-lib-instrument
 * `visitor.js` (branch types), istanbuljs/istanbuljs.
 */
import type { BranchRecord, CoverageReport, FileCoverage, FunctionHits } from './CoverageReport';
import { CoverageFormatError } from './CoverageFormatError';

type Json = Record<string, unknown>;

/** Parses an Istanbul JSON value (already `JSON.parse`d); throws `CoverageFormatError` naming the path inside it. */
export function parseIstanbulJson(json: unknown): CoverageReport {
  if (!isObject(json)) throw new CoverageFormatError('an Istanbul report is a JSON object keyed by file path', undefined, '(root)');
  const files = new Map<string, FileCoverage>();
  for (const [key, value] of Object.entries(json)) {
    const entry = isObject(value) && isObject(value.data) ? value.data : value;
    if (!isObject(entry)) throw new CoverageFormatError('a file entry must be an object', undefined, key);
    const path = typeof entry.path === 'string' && entry.path !== '' ? entry.path : key;
    files.set(path, readFile(entry, key));
  }
  return { format: 'istanbul', files };
}

function readFile(entry: Json, key: string): FileCoverage {
  const statementMap = field(entry, 'statementMap', key);
  const s = field(entry, 's', key);
  const fnMap = field(entry, 'fnMap', key);
  const f = field(entry, 'f', key);
  const branchMap = field(entry, 'branchMap', key);
  const b = field(entry, 'b', key);

  const lines = new Map<number, number>();
  for (const [id, loc] of Object.entries(statementMap)) {
    const where = `${key} › statementMap › ${id}`;
    const line = startOf(loc, where).line;
    const hits = hitCount(s[id], `${key} › s › ${id}`);
    if ((lines.get(line) ?? -1) < hits) lines.set(line, hits);
  }

  const functions: FunctionHits[] = [];
  for (const [id, meta] of Object.entries(fnMap)) {
    const where = `${key} › fnMap › ${id}`;
    if (!isObject(meta)) throw new CoverageFormatError('a function entry must be an object', undefined, where);
    const decl = isObject(meta.decl) ? meta.decl : meta.loc;
    const line = startOf(decl, where).line;
    const endLine = isObject(meta.loc) && isObject(meta.loc.end) && isLine(meta.loc.end.line) ? meta.loc.end.line : undefined;
    const name = typeof meta.name === 'string' ? meta.name : `(function ${id})`;
    functions.push({ name, line, calls: hitCount(f[id], `${key} › f › ${id}`), ...(endLine !== undefined ? { endLine } : {}) });
  }

  const branches: BranchRecord[] = [];
  // Integer-like keys enumerate in ascending numeric order: the instrumenter's creation order.
  for (const [id, meta] of Object.entries(branchMap)) {
    const where = `${key} › branchMap › ${id}`;
    if (!isObject(meta)) throw new CoverageFormatError('a branch entry must be an object', undefined, where);
    const line = isObject(meta.loc) ? startOf(meta.loc, where).line : isLine(meta.line) ? meta.line : badPlace(where);
    const raw = b[id];
    if (!Array.isArray(raw)) throw new CoverageFormatError('branch hits must be an array', undefined, `${key} › b › ${id}`);
    const counts = raw.map((c, i) => hitCount(c, `${key} › b › ${id} › ${i}`));
    const locations = Array.isArray(meta.locations) ? meta.locations.map(optionalStart) : undefined;
    branches.push({
      line,
      block: id,
      ...(typeof meta.type === 'string' ? { type: meta.type } : {}),
      counts,
      ...(locations ? { locations } : {}),
    });
  }
  return { branches, lines, functions };
}

function field(entry: Json, name: string, key: string): Json {
  const value = entry[name];
  if (!isObject(value)) throw new CoverageFormatError(`missing or non-object "${name}"`, undefined, key);
  return value;
}

function startOf(loc: unknown, where: string): { line: number; column: number } {
  const start = isObject(loc) ? loc.start : undefined;
  if (!isObject(start) || !isLine(start.line)) return badPlace(where);
  const column = typeof start.column === 'number' && start.column >= 0 ? start.column + 1 : 1;
  return { line: start.line, column };
}

function optionalStart(loc: unknown): { line: number; column: number } | null {
  // Istanbul leaves an implicit `else` without a place (`{}` or start.line undefined).
  const start = isObject(loc) ? loc.start : undefined;
  if (!isObject(start) || !isLine(start.line)) return null;
  return { line: start.line, column: typeof start.column === 'number' && start.column >= 0 ? start.column + 1 : 1 };
}

function badPlace(where: string): never {
  throw new CoverageFormatError('missing start line', undefined, where);
}

function hitCount(value: unknown, where: string): number {
  if (typeof value !== 'number' || !Number.isInteger(value) || value < 0) {
    throw new CoverageFormatError(`hit count must be a whole number ≥ 0, got ${JSON.stringify(value)}`, undefined, where);
  }
  return value;
}

function isLine(value: unknown): value is number {
  return typeof value === 'number' && Number.isInteger(value) && value >= 1;
}

function isObject(value: unknown): value is Json {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}
