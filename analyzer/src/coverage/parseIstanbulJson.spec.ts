import { CoverageFormatError } from './CoverageFormatError';
import { parseIstanbulJson } from './parseIstanbulJson';

const loc = (line: number, column: number, endLine = line, endColumn: number | null = null) => ({
  start: { line, column },
  end: { line: endLine, column: endColumn },
});

// Shape as written by jest --coverageReporters=json (coverage-final.json), trimmed by hand.
const FILE = {
  path: '/ci/app/src/grade.ts',
  statementMap: { 0: loc(5, 2, 9), 1: loc(6, 4), 2: loc(7, 9), 3: loc(7, 20), 4: loc(10, 2) },
  s: { 0: 2, 1: 1, 2: 1, 3: 3, 4: 0 },
  fnMap: { 0: { name: 'grade', decl: loc(4, 16, 4, 21), loc: loc(4, 35, 11) } },
  f: { 0: 2 },
  branchMap: {
    0: { type: 'if', loc: loc(5, 2, 9), locations: [loc(5, 2, 9), loc(7, 9, 9)], line: 5 },
    1: { type: 'if', loc: loc(7, 9, 9), locations: [loc(7, 9, 9), { start: {}, end: {} }], line: 7 },
    2: { type: 'binary-expr', loc: loc(15, 9), locations: [loc(15, 9), loc(15, 18), loc(15, 28)], line: 15 },
  },
  b: { 0: [1, 1], 1: [0, 1], 2: [2, 1, 1] },
};

describe('parseIstanbulJson', () => {
  it('keeps types, counts and 1-based outcome places in key order', () => {
    const report = parseIstanbulJson({ [FILE.path]: FILE });
    expect(report.format).toBe('istanbul');
    const file = report.files.get('/ci/app/src/grade.ts')!;
    expect(file.branches.map((b) => [b.line, b.block, b.type, b.counts])).toEqual([
      [5, '0', 'if', [1, 1]],
      [7, '1', 'if', [0, 1]],
      [15, '2', 'binary-expr', [2, 1, 1]],
    ]);
    expect(file.branches[0].locations).toEqual([{ line: 5, column: 3 }, { line: 7, column: 10 }]);
    expect(file.branches[1].locations).toEqual([{ line: 7, column: 10 }, null]);
  });

  it('derives line hits as the largest count of the statements starting on a line (as Istanbul\'s lcov writer does)', () => {
    const file = parseIstanbulJson({ x: FILE }).files.get(FILE.path)!;
    expect([...file.lines]).toEqual([[5, 2], [6, 1], [7, 3], [10, 0]]);
    expect(file.functions).toEqual([{ name: 'grade', line: 4, endLine: 11, calls: 2 }]);
  });

  it('accepts entries wrapped as { data } and falls back to the key without a path', () => {
    const { path: _path, ...withoutPath } = FILE;
    const report = parseIstanbulJson({ 'src/a.ts': { data: withoutPath } });
    expect([...report.files.keys()]).toEqual(['src/a.ts']);
  });

  it.each([
    [[], '(root)', /JSON object keyed by file path/],
    [{ 'a.ts': 3 }, 'a.ts', /file entry must be an object/],
    [{ 'a.ts': { ...FILE, branchMap: undefined } }, 'a.ts', /"branchMap"/],
    [{ 'a.ts': { ...FILE, s: { ...FILE.s, 1: -1 } } }, 'a.ts › s › 1', /whole number/],
    [{ 'a.ts': { ...FILE, b: { ...FILE.b, 2: 'x' } } }, 'a.ts › b › 2', /must be an array/],
    [{ 'a.ts': { ...FILE, statementMap: { ...FILE.statementMap, 0: {} } } }, 'a.ts › statementMap › 0', /missing start line/],
  ])('refuses malformed input %#, naming where', (json, where, message) => {
    let error: unknown;
    try {
      parseIstanbulJson(json);
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(CoverageFormatError);
    expect((error as CoverageFormatError).where).toBe(where);
    expect((error as Error).message).toMatch(message);
  });
});
