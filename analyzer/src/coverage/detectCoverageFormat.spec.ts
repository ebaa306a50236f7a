import { CoverageFormatError } from './CoverageFormatError';
import { detectCoverageFormat } from './detectCoverageFormat';
import { parseCoverageReport } from './parseCoverageReport';

describe('detectCoverageFormat', () => {
  it.each([
    ['TN:\nSF:a.ts\nend_of_record\n', 'lcov'],
    ['\n\nSF:a.ts\nDA:1,1\nend_of_record', 'lcov'],
    ['\uFEFF{"a.ts": {}}', 'istanbul'],
    ['  {\n}', 'istanbul'],
  ])('%j is %s', (text, format) => {
    expect(detectCoverageFormat(text)).toBe(format);
  });

  it.each(['', '   \n', '<coverage line-rate="1"/>', 'hello'])('refuses %j', (text) => {
    expect(() => detectCoverageFormat(text)).toThrow(CoverageFormatError);
  });
});

describe('parseCoverageReport', () => {
  it('reads both formats', () => {
    expect(parseCoverageReport('SF:a.ts\nDA:1,2\nend_of_record\n').files.get('a.ts')!.lines.get(1)).toBe(2);
    const json = JSON.stringify({ 'a.ts': { statementMap: {}, s: {}, fnMap: {}, f: {}, branchMap: {}, b: {} } });
    expect(parseCoverageReport(json).format).toBe('istanbul');
  });

  it('turns a JSON syntax error into a CoverageFormatError', () => {
    expect(() => parseCoverageReport('{"a.ts": ')).toThrow(/analyzer\/coverage: not valid JSON/);
  });
});
