import { functionRow } from './function-fixtures';
import { coveragePercent, functionsCsv, toCsv } from './functions-csv';

describe('toCsv', () => {
  it('should end every record with CRLF and leave plain fields bare', () => {
    expect(toCsv(['a', 'b'], [[1, 'x'], [true, null]])).toBe('a,b\r\n1,x\r\ntrue,\r\n');
  });

  it('should quote fields with commas, quotes and line breaks, doubling inner quotes', () => {
    const csv = toCsv(['name'], [['a,b'], ['say "hi"'], ['two\nlines'], ['cr\rhere'], [undefined]]);
    expect(csv).toBe('name\r\n"a,b"\r\n"say ""hi"""\r\n"two\nlines"\r\n"cr\rhere"\r\n\r\n');
  });

  it('should keep text a spreadsheet would run as a formula from running, but leave numbers alone', () => {
    const csv = toCsv(['v'], [['=HYPERLINK("x")'], ['+1'], ['-cmd'], ['@SUM(A1)'], ['\tx'], [-3], ['a=b']]);
    expect(csv).toBe(`v\r\n"'=HYPERLINK(""x"")"\r\n'+1\r\n'-cmd\r\n'@SUM(A1)\r\n'\tx\r\n-3\r\na=b\r\n`);
  });
});

describe('functionsCsv', () => {
  const plan = functionRow({ qualifiedName: 'Router.plan, v2', outcomesCovered: 36, outcomesTotal: 80, untestedPaths: 35, crap: 320.676375 });

  it('should write the figures without coverage columns when there is no coverage', () => {
    const lines = functionsCsv([plan], false).split('\r\n');
    expect(lines[0]).toBe('id,qualifiedName,kind,file,line,endLine,cyclomatic,essential,decisions,loc,band,overLimit,cluster');
    expect(lines[1]).toBe('fn-plan,"Router.plan, v2",function,src/dispatch-core/planDispatch.ts,23,126,41,17,40,96,tangled,true,c1');
    expect(lines).toHaveLength(3);
    expect(lines[2]).toBe('');
  });

  it('should add outcomes, coverage, untested paths and CRAP with coverage', () => {
    const lines = functionsCsv([plan, functionRow({ id: 'fn-2', cluster: null })], true).split('\r\n');
    expect(lines[0].endsWith(',cluster,outcomesCovered,outcomesTotal,coveragePercent,untestedPaths,crap')).toBe(true);
    expect(lines[1].endsWith(',c1,36,80,45,35,320.68')).toBe(true);
    // A function missing from the coverage report has empty coverage fields.
    expect(lines[2].endsWith(',true,,,,,,')).toBe(true);
  });
});

describe('coveragePercent', () => {
  it('should give covered outcomes over all outcomes with one decimal', () => {
    expect(coveragePercent({ outcomesCovered: 1, outcomesTotal: 3 })).toBe(33.3);
    expect(coveragePercent({ outcomesCovered: 0, outcomesTotal: 4 })).toBe(0);
  });

  it('should give null without coverage or without outcomes', () => {
    expect(coveragePercent({ outcomesCovered: null, outcomesTotal: null })).toBeNull();
    expect(coveragePercent({ outcomesCovered: 0, outcomesTotal: 0 })).toBeNull();
  });
});
