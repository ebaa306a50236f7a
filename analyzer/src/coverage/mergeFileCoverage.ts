/**
 * Adding up coverage of one file
 * ==============================
 * lcov writes one record per test name, so a file may appear several times; Istanbul
 * reports from several runs may also be combined. Line and function hits add up; branch
 * records with the same line and block add up outcome by outcome (`null`, "never ran",
 * counts as nothing).
 */
import type { FileCoverage } from './CoverageReport';

/** Adds up two reports of the same file (as lcov writes one record per test name). */
export function mergeFileCoverage(a: FileCoverage, b: FileCoverage): FileCoverage {
  const lines = new Map(a.lines);
  for (const [line, hits] of b.lines) lines.set(line, (lines.get(line) ?? 0) + hits);
  const branches = a.branches.map((r) => ({ ...r, counts: [...r.counts] }));
  const byKey = new Map(branches.map((r) => [`${r.line}:${r.block}`, r]));
  for (const r of b.branches) {
    const same = byKey.get(`${r.line}:${r.block}`);
    if (!same) {
      branches.push({ ...r, counts: [...r.counts] });
      continue;
    }
    r.counts.forEach((c, i) => {
      const mine = same.counts[i];
      same.counts[i] = mine === null || mine === undefined ? c : c === null ? mine : mine + c;
    });
  }
  const functions = a.functions.map((f) => ({ ...f }));
  const byName = new Map(functions.map((f) => [`${f.line}:${f.name}`, f]));
  for (const f of b.functions) {
    const same = byName.get(`${f.line}:${f.name}`);
    if (same) same.calls += f.calls;
    else functions.push({ ...f });
  }
  return { branches, lines, functions };
}
