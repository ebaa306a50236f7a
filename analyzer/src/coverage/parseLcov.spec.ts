import { CoverageFormatError } from './CoverageFormatError';
import { parseLcov } from './parseLcov';

// Shape as written by istanbul-reports' lcovonly writer (jest --coverageReporters=lcovonly).
const SAMPLE = `TN:
SF:src/grade.ts
FN:4,grade
FNF:1
FNH:1
FNDA:2,grade
DA:5,2
DA:6,1
DA:7,1
DA:10,0
LF:4
LH:3
BRDA:5,0,0,1
BRDA:5,0,1,1
BRDA:7,1,0,-
BRDA:7,1,1,0
BRDA:15,2,0,2
BRDA:15,2,1,1
BRDA:15,2,2,1
BRF:7
BRH:5
end_of_record
`;

describe('parseLcov', () => {
  it('groups BRDA lines into one record per line and block, "-" as null', () => {
    const file = parseLcov(SAMPLE).files.get('src/grade.ts')!;
    expect(file.branches).toEqual([
      { line: 5, block: '0', counts: [1, 1] },
      { line: 7, block: '1', counts: [null, 0] },
      { line: 15, block: '2', counts: [2, 1, 1] },
    ]);
    expect([...file.lines]).toEqual([[5, 2], [6, 1], [7, 1], [10, 0]]);
    expect(file.functions).toEqual([{ name: 'grade', line: 4, calls: 2 }]);
  });

  it('says lcov and keys files by the path as written', () => {
    const report = parseLcov(SAMPLE.replace('SF:src/grade.ts', 'SF:/home/ci/app/src/grade.ts'));
    expect(report.format).toBe('lcov');
    expect([...report.files.keys()]).toEqual(['/home/ci/app/src/grade.ts']);
  });

  it('adds up a file recorded once per test name', () => {
    const twice = `${SAMPLE}TN:other\n${SAMPLE.replace('TN:\n', '')}`;
    const file = parseLcov(twice).files.get('src/grade.ts')!;
    expect(file.lines.get(5)).toBe(4);
    expect(file.branches[1].counts).toEqual([null, 0]);
    expect(file.branches[2].counts).toEqual([4, 2, 2]);
    expect(file.functions[0].calls).toBe(4);
  });

  it('reads lcov 2 function ranges, ignores unknown records and takes a last record without end_of_record', () => {
    const text = 'VER:2.0\nSF:a.ts\nFN:3,9,run\nFNDA:5,run\nXYZ:whatever\nFNL:0,3,9\nDA:4,5,abc123\n';
    const file = parseLcov(text).files.get('a.ts')!;
    expect(file.functions).toEqual([{ name: 'run', line: 3, endLine: 9, calls: 5 }]);
    expect(file.lines.get(4)).toBe(5);
  });

  it.each([
    ['DA:1,1\n', 1, /DA before any SF/],
    ['SF:a.ts\nDA:x,1\n', 2, /DA line must be a line number/],
    ['SF:a.ts\nDA:1,-3\n', 2, /DA hits must be a whole number/],
    ['SF:a.ts\nBRDA:1,0,1\n', 2, /BRDA needs line,block,branch,taken/],
    ['SF:a.ts\nBRDA:1,0,0,many\n', 2, /BRDA taken/],
    ['SF:a.ts\nSF:b.ts\n', 2, /SF before end_of_record of a.ts/],
    ['end_of_record\n', 1, /end_of_record without SF/],
    ['SF:a.ts\nFN:0,f\n', 2, /FN line must be a line number ≥ 1/],
    ['SF:a.ts\nFNDA:3\n', 2, /FNDA needs hits,name/],
  ])('refuses %j with the line number', (text, line, message) => {
    let error: unknown;
    try {
      parseLcov(text);
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(CoverageFormatError);
    expect((error as CoverageFormatError).line).toBe(line);
    expect((error as Error).message).toMatch(/^analyzer\/coverage: line \d+: /);
    expect((error as Error).message).toMatch(message);
  });
});
