/**
 * Reading lcov tracefiles
 * =======================
 * Parses the lcov text format (`SF`, `FN`, `FNDA`, `DA`, `BRDA`, `end_of_record`) into the
 * normalised `CoverageReport`. `BRDA` lines sharing a line and a block become one branch
 * record, outcomes in the order the report lists them; `-` (the branch point never ran)
 * becomes `null`. A file named twice (one record per test name) has its hits added up.
 * Summary records (`FNF`, `LH`, `BRF`, …), `TN`, `VER` and unknown records are ignored; a
 * last record without `end_of_record` is still taken. lcov 2's `FN:start,end,name` and its
 * `e`-prefixed exception blocks are understood.
 *
 * [Reference]: geninfo(1) "TRACEFILE FORMAT", linux-test-project/lcov.
 */
import type { BranchRecord, CoverageReport, FileCoverage, FunctionHits } from './CoverageReport';
import { CoverageFormatError } from './CoverageFormatError';
import { mergeFileCoverage } from './mergeFileCoverage';

interface OpenRecord {
  path: string;
  coverage: FileCoverage;
  /** `line:block` → record, to group BRDA lines. */
  blocks: Map<string, BranchRecord>;
  /** Function name → its FN entry, so FNDA can find it. */
  byName: Map<string, FunctionHits>;
}

/** Parses an lcov tracefile; throws `CoverageFormatError` with the line number on malformed input. */
export function parseLcov(text: string): CoverageReport {
  const files = new Map<string, FileCoverage>();
  let open: OpenRecord | undefined;
  const lines = text.split(/\r?\n/);
  for (let i = 0; i < lines.length; i++) {
    const lineNo = i + 1;
    const raw = lines[i].trim();
    if (raw === '') continue;
    const colon = raw.indexOf(':');
    const tag = colon < 0 ? raw : raw.slice(0, colon);
    const value = colon < 0 ? '' : raw.slice(colon + 1);
    if (tag === 'SF') {
      if (open) throw new CoverageFormatError(`SF before end_of_record of ${open.path}`, lineNo);
      if (value === '') throw new CoverageFormatError('SF without a path', lineNo);
      open = openRecord(value);
      continue;
    }
    if (tag === 'end_of_record') {
      if (!open) throw new CoverageFormatError('end_of_record without SF', lineNo);
      closeRecord(files, open);
      open = undefined;
      continue;
    }
    if (tag !== 'FN' && tag !== 'FNDA' && tag !== 'DA' && tag !== 'BRDA') continue;
    if (!open) throw new CoverageFormatError(`${tag} before any SF`, lineNo);
    if (tag === 'DA') readDa(open, value, lineNo);
    else if (tag === 'BRDA') readBrda(open, value, lineNo);
    else if (tag === 'FN') readFn(open, value, lineNo);
    else readFnda(open, value, lineNo);
  }
  if (open) closeRecord(files, open);
  return { format: 'lcov', files };
}

function openRecord(path: string): OpenRecord {
  return { path, coverage: { branches: [], lines: new Map(), functions: [] }, blocks: new Map(), byName: new Map() };
}

function closeRecord(files: Map<string, FileCoverage>, open: OpenRecord): void {
  const earlier = files.get(open.path);
  files.set(open.path, earlier ? mergeFileCoverage(earlier, open.coverage) : open.coverage);
}

function readDa(open: OpenRecord, value: string, lineNo: number): void {
  const [line, hits] = value.split(',');
  const l = lineNumber(line, lineNo, 'DA line');
  open.coverage.lines.set(l, (open.coverage.lines.get(l) ?? 0) + count(hits, lineNo, 'DA hits'));
}

function readBrda(open: OpenRecord, value: string, lineNo: number): void {
  const parts = value.split(',');
  if (parts.length < 4) throw new CoverageFormatError(`BRDA needs line,block,branch,taken, got "${value}"`, lineNo);
  const line = lineNumber(parts[0], lineNo, 'BRDA line');
  const block = parts[1].trim();
  if (block === '') throw new CoverageFormatError('BRDA without a block id', lineNo);
  // lcov 2 allows a branch expression containing commas between block and taken: taken is last.
  const takenText = parts[parts.length - 1].trim();
  const taken = takenText === '-' ? null : count(takenText, lineNo, 'BRDA taken');
  const key = `${line}:${block}`;
  let record = open.blocks.get(key);
  if (!record) {
    record = { line, block, counts: [] };
    open.blocks.set(key, record);
    open.coverage.branches.push(record);
  }
  record.counts.push(taken);
}

function readFn(open: OpenRecord, value: string, lineNo: number): void {
  const parts = value.split(',');
  if (parts.length < 2) throw new CoverageFormatError(`FN needs line,name, got "${value}"`, lineNo);
  const line = lineNumber(parts[0], lineNo, 'FN line');
  // lcov 2: FN:<start>,<end>,<name>; lcov 1: FN:<line>,<name> (a name may itself hold commas).
  const hasEnd = parts.length >= 3 && /^\d+$/.test(parts[1].trim());
  const endLine = hasEnd ? lineNumber(parts[1], lineNo, 'FN end line') : undefined;
  const name = parts.slice(hasEnd ? 2 : 1).join(',');
  const fn: FunctionHits = { name, line, calls: 0, ...(endLine !== undefined ? { endLine } : {}) };
  open.coverage.functions.push(fn);
  open.byName.set(name, fn);
}

function readFnda(open: OpenRecord, value: string, lineNo: number): void {
  const comma = value.indexOf(',');
  if (comma < 0) throw new CoverageFormatError(`FNDA needs hits,name, got "${value}"`, lineNo);
  const calls = count(value.slice(0, comma), lineNo, 'FNDA hits');
  const name = value.slice(comma + 1);
  const fn = open.byName.get(name);
  // An FNDA for a function without FN carries no line; nothing can be mapped from it.
  if (fn) fn.calls += calls;
}

function lineNumber(text: string | undefined, lineNo: number, what: string): number {
  const t = (text ?? '').trim();
  if (!/^\d+$/.test(t) || Number(t) < 1) throw new CoverageFormatError(`${what} must be a line number ≥ 1, got "${t}"`, lineNo);
  return Number(t);
}

function count(text: string | undefined, lineNo: number, what: string): number {
  const t = (text ?? '').trim();
  if (!/^\d+$/.test(t)) throw new CoverageFormatError(`${what} must be a whole number ≥ 0, got "${t}"`, lineNo);
  return Number(t);
}
