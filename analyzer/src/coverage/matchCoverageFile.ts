/**
 * Matching a report's file path to a scanned file
 * ===============================================
 * Reports name files as the test run saw them: absolute, relative to another working
 * directory, with backslashes. A report path matches the scanned file (posix, relative to
 * the scan root) sharing the longest run of trailing path segments with it, at least the file
 * name; when two scanned files share equally long runs the match is ambiguous and refused.
 */

/** The scanned file a report path names, or null when none or more than one fits best. */
export function matchCoverageFile(reportPath: string, scannedFiles: readonly string[]): string | null {
  return createCoverageFileMatcher(scannedFiles)(reportPath);
}

/** The same matching, with the scanned files indexed once for many report paths. */
export function createCoverageFileMatcher(scannedFiles: readonly string[]): (reportPath: string) => string | null {
  const byName = new Map<string, { file: string; segments: string[] }[]>();
  for (const file of scannedFiles) {
    const segments = segmentsOf(file);
    const name = segments[segments.length - 1];
    if (name === undefined) continue;
    const list = byName.get(name) ?? [];
    list.push({ file, segments });
    byName.set(name, list);
  }
  return (reportPath) => {
    const segments = segmentsOf(reportPath);
    const candidates = byName.get(segments[segments.length - 1] ?? '') ?? [];
    let best: string | null = null;
    let bestLength = 0;
    let tie = false;
    for (const c of candidates) {
      const length = commonSuffix(segments, c.segments);
      if (length > bestLength) [best, bestLength, tie] = [c.file, length, false];
      else if (length === bestLength) tie = true;
    }
    return tie ? null : best;
  };
}

function segmentsOf(path: string): string[] {
  return path
    .replace(/^file:\/\//, '')
    .replace(/\\/g, '/')
    .split('/')
    .filter((s) => s !== '' && s !== '.');
}

function commonSuffix(a: string[], b: string[]): number {
  let n = 0;
  while (n < a.length && n < b.length && a[a.length - 1 - n] === b[b.length - 1 - n]) n++;
  return n;
}
