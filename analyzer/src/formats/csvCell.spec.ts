import { csvCell, csvRow } from './csvCell';

describe('csvCell', () => {
  it('should quote fields with commas, quotes and line breaks and double the quotes', () => {
    // RFC 4180 §2.6–2.7: fields containing line breaks, double quotes and commas are enclosed in
    // double quotes; a double quote inside is escaped by another double quote.
    expect(csvCell('a,b')).toBe('"a,b"');
    expect(csvCell('say "hi"')).toBe('"say ""hi"""');
    expect(csvCell('two\nlines')).toBe('"two\nlines"');
    expect(csvCell('cr\rhere')).toBe('"cr\rhere"');
  });

  it('should leave plain text and numbers as they are', () => {
    expect(csvCell('Orders.assign')).toBe('Orders.assign');
    expect(csvCell(42)).toBe('42');
    expect(csvCell(4.5)).toBe('4.5');
    expect(csvCell(true)).toBe('true');
    expect(csvCell(undefined)).toBe('');
    expect(csvCell(Number.NaN)).toBe('');
  });

  it.each(['=SUM(A1:A9)', '+1', '-1+2', '@cmd', '\tx', '\rx'])('should defuse the formula start of %j', (value) => {
    // common practice (OWASP "CSV Injection"): cells starting with = + - @ tab or CR get a leading quote.
    const cell = csvCell(value);
    const unquoted = cell.startsWith('"') ? cell.slice(1, -1).replace(/""/g, '"') : cell;
    expect(unquoted).toBe(`'${value}`);
  });

  it('should defuse and still quote a formula holding a comma', () => {
    expect(csvCell('=HYPERLINK("x",1)')).toBe('"\'=HYPERLINK(""x"",1)"');
  });

  it('should not touch negative numbers given as numbers', () => {
    expect(csvCell(-3)).toBe('-3');
  });
});

describe('csvRow', () => {
  it('should join cells with commas and end with CRLF', () => {
    // RFC 4180 §2.1: each record is located on a separate line, delimited by CRLF.
    expect(csvRow(['a', 1, undefined, 'b,c'])).toBe('a,1,,"b,c"\r\n');
  });
});
