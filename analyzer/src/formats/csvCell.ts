/**
 * One CSV cell
 * ============
 * Quotes a value for a CSV file: a field holding a comma, a double quote, CR or LF is enclosed in
 * double quotes and its quotes doubled. Text that a spreadsheet would run as a formula (starting
 * with = + - @, a tab or CR) is prefixed with a single quote, so opening the file never evaluates
 * anything taken from the scanned code. Numbers are written as they are.
 *
 * [Reference]: RFC 4180 §2 (quoting); OWASP "CSV Injection" (the formula prefixes, common practice).
 */

const FORMULA_START = /^[=+\-@\t\r]/;
const NEEDS_QUOTES = /[",\r\n]/;

/** The CSV text of one cell (empty for null and undefined). */
export function csvCell(value: string | number | boolean | null | undefined): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  if (typeof value === 'boolean') return value ? 'true' : 'false';
  const guarded = FORMULA_START.test(value) ? `'${value}` : value;
  return NEEDS_QUOTES.test(guarded) ? `"${guarded.replace(/"/g, '""')}"` : guarded;
}

/** One CSV record: cells joined by commas, ended by CRLF (RFC 4180 §2.1). */
export function csvRow(cells: readonly (string | number | boolean | null | undefined)[]): string {
  return `${cells.map(csvCell).join(',')}\r\n`;
}
