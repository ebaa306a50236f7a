/**
 * Matching functions across two snapshots
 * =======================================
 * Each before-function is matched to at most one after-function, in passes so that a closer
 * match always wins over a looser one (within a pass, functions are taken in snapshot order):
 *   1. same id (file, stable qualified name, ordinal) and same body fingerprint → `same`;
 *   2. same file, name and fingerprint under another id: only the ordinal moved (a same-named
 *      function was added or removed above it) → `same`;
 *   3. same id, body changed → `changed` (even when V(G) did not move: the fingerprint ignores
 *      whitespace, comments and local names, so a new one means the code changed);
 *   4. same fingerprint and name in another file → `moved` (a moved file moves all its functions);
 *   5. same fingerprint in the same file under another name → `renamed`.
 * The rest are `added` or `removed`. A body that changed *and* moved, or changed and was renamed,
 * cannot be told from a removal plus an addition, and is reported as those.
 */
import type { FunctionRecord } from '../model';
import type { FunctionShiftStatus } from './Shift';

/** One function on one or both sides. */
export interface FunctionMatch {
  status: FunctionShiftStatus;
  before: FunctionRecord | null;
  after: FunctionRecord | null;
}

interface Pass {
  key: (fn: FunctionRecord) => string;
  /** The status of a pair under this pass, or undefined to leave the pair for a later pass. */
  status: (before: FunctionRecord, after: FunctionRecord) => FunctionShiftStatus | undefined;
}

const sameBody = (b: FunctionRecord, a: FunctionRecord) => b.fingerprint === a.fingerprint;
const sameFigures = (b: FunctionRecord, a: FunctionRecord) => b.cyclomatic === a.cyclomatic && b.cyclomaticStrict === a.cyclomaticStrict && b.decisions === a.decisions;

// NOTE: keys join fields with NUL, which appears in neither paths nor names.
const PASSES: Pass[] = [
  { key: (fn) => fn.id, status: (b, a) => (sameBody(b, a) ? (sameFigures(b, a) ? 'same' : 'changed') : undefined) },
  { key: (fn) => `${fn.fingerprint}\0${fn.file}\0${fn.qualifiedName}`, status: (b, a) => (sameFigures(b, a) ? 'same' : 'changed') },
  { key: (fn) => fn.id, status: () => 'changed' },
  { key: (fn) => `${fn.fingerprint}\0\0${fn.qualifiedName}`, status: (b, a) => (b.file !== a.file ? 'moved' : undefined) },
  { key: (fn) => `${fn.fingerprint}\0${fn.file}`, status: (b, a) => (b.qualifiedName !== a.qualifiedName ? 'renamed' : undefined) },
];

/** Matches, in after-snapshot order, followed by removed functions in before-snapshot order. */
export function matchFunctions(before: readonly FunctionRecord[], after: readonly FunctionRecord[]): FunctionMatch[] {
  const matchOfAfter = new Map<FunctionRecord, FunctionMatch>();
  const matchedBefore = new Set<FunctionRecord>();
  for (const pass of PASSES) {
    // A cursor per key skips candidates already taken, so many identical bodies (empty arrows)
    // stay linear. After pass 2 no free after-function shares fingerprint, file and name with a
    // free before-function, so the first free candidate under a key of passes 4 and 5 fits.
    const candidates = new Map<string, { list: FunctionRecord[]; next: number }>();
    for (const a of after) {
      if (matchOfAfter.has(a)) continue;
      const key = pass.key(a);
      (candidates.get(key) ?? candidates.set(key, { list: [], next: 0 }).get(key)!).list.push(a);
    }
    for (const b of before) {
      if (matchedBefore.has(b)) continue;
      const entry = candidates.get(pass.key(b));
      if (entry === undefined) continue;
      while (entry.next < entry.list.length && matchOfAfter.has(entry.list[entry.next])) entry.next++;
      const a = entry.list[entry.next];
      const status = a && pass.status(b, a);
      if (a === undefined || status === undefined) continue;
      matchOfAfter.set(a, { status, before: b, after: a });
      matchedBefore.add(b);
    }
  }
  const matches: FunctionMatch[] = after.map((a) => matchOfAfter.get(a) ?? { status: 'added', before: null, after: a });
  for (const b of before) if (!matchedBefore.has(b)) matches.push({ status: 'removed', before: b, after: null });
  return matches;
}
