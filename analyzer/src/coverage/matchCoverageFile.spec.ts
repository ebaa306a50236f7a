import { assignReportFiles } from './assignReportFiles';
import type { FileCoverage } from './CoverageReport';
import { matchCoverageFile } from './matchCoverageFile';

const SCANNED = ['src/a/index.ts', 'src/b/index.ts', 'src/util.ts', 'lib/util.ts', 'main.ts'];

describe('matchCoverageFile', () => {
  it.each([
    ['/home/ci/repo/src/a/index.ts', 'src/a/index.ts'],
    ['C:\\work\\repo\\src\\b\\index.ts', 'src/b/index.ts'],
    ['./main.ts', 'main.ts'],
    ['file:///ci/main.ts', 'main.ts'],
    ['packages/app/src/util.ts', 'src/util.ts'],
    ['src/a/index.ts', 'src/a/index.ts'],
  ])('%s → %s (longest common path suffix)', (reportPath, expected) => {
    expect(matchCoverageFile(reportPath, SCANNED)).toBe(expected);
  });

  it.each([
    ['/ci/index.ts', 'two scanned index.ts share only the file name'],
    ['/ci/util.ts', 'src/util.ts and lib/util.ts tie'],
    ['/ci/other.ts', 'no scanned file of that name'],
    ['/ci/src/a/index.tsx', 'the file name must match in full'],
  ])('%s → null (%s)', (reportPath) => {
    expect(matchCoverageFile(reportPath, SCANNED)).toBeNull();
  });
});

describe('assignReportFiles', () => {
  const file = (hits: number): FileCoverage => ({ branches: [], lines: new Map([[1, hits]]), functions: [] });

  it('assigns matched files, adds up duplicates and lists the rest', () => {
    const report = {
      format: 'lcov' as const,
      files: new Map([
        ['/ci/main.ts', file(1)],
        ['main.ts', file(2)],
        ['/ci/vendor/x.ts', file(3)],
        ['/ci/index.ts', file(4)],
      ]),
    };
    const { byFile, unmatchedFiles } = assignReportFiles(report, SCANNED);
    expect([...byFile.keys()]).toEqual(['main.ts']);
    expect(byFile.get('main.ts')!.lines.get(1)).toBe(3);
    expect(unmatchedFiles).toEqual(['/ci/vendor/x.ts', '/ci/index.ts']);
  });
});
