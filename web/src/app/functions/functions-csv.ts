import type { FunctionRow } from './functions-types';

/** A cell value as it may appear in a CSV. */
export type CsvValue = string | number | boolean | null | undefined;

/** One CSV column: its header and how a row fills it. */
interface CsvColumn {
  header: string;
  value: (row: FunctionRow) => CsvValue;
}

/** Columns every export carries. */
const BASE_COLUMNS: readonly CsvColumn[] = [
  { header: 'id', value: (r) => r.id },
  { header: 'qualifiedName', value: (r) => r.qualifiedName },
  { header: 'kind', value: (r) => r.kind },
  { header: 'file', value: (r) => r.file },
  { header: 'line', value: (r) => r.line },
  { header: 'endLine', value: (r) => r.endLine },
  { header: 'cyclomatic', value: (r) => r.cyclomatic },
  { header: 'essential', value: (r) => r.essential },
  { header: 'decisions', value: (r) => r.decisions },
  { header: 'loc', value: (r) => r.loc },
  { header: 'band', value: (r) => r.band },
  { header: 'overLimit', value: (r) => r.overLimit },
  { header: 'cluster', value: (r) => r.cluster },
];

/** Columns added when the snapshot has coverage. */
const COVERAGE_COLUMNS: readonly CsvColumn[] = [
  { header: 'outcomesCovered', value: (r) => r.outcomesCovered },
  { header: 'outcomesTotal', value: (r) => r.outcomesTotal },
  { header: 'coveragePercent', value: (r) => coveragePercent(r) },
  { header: 'untestedPaths', value: (r) => r.untestedPaths },
  { header: 'crap', value: (r) => (r.crap === null ? null : Math.round(r.crap * 100) / 100) },
];

/** Covered branch outcomes over all outcomes in percent (one decimal), or null without coverage. */
export function coveragePercent(row: Pick<FunctionRow, 'outcomesCovered' | 'outcomesTotal'>): number | null {
  if (row.outcomesCovered === null || row.outcomesTotal === null) return null;
  // A function without decisions has one path: the body ran or it did not; the server counts no outcomes.
  if (row.outcomesTotal === 0) return null;
  return Math.round((row.outcomesCovered / row.outcomesTotal) * 1000) / 10;
}

/** The functions as CSV text: a header line, then one line per row (coverage columns on request). */
export function functionsCsv(rows: readonly FunctionRow[], withCoverage: boolean): string {
  const columns = withCoverage ? [...BASE_COLUMNS, ...COVERAGE_COLUMNS] : BASE_COLUMNS;
  return toCsv(
    columns.map((c) => c.header),
    rows.map((row) => columns.map((c) => c.value(row))),
  );
}

/**
 * CSV text as RFC 4180 describes it: CRLF line breaks (also after the last record), fields
 * holding a comma, double quote, CR or LF enclosed in double quotes, inner quotes doubled.
 * Null and undefined become empty fields. Text a spreadsheet would run as a formula (starting
 * with = + - @, a tab or CR) gets a leading single quote, as the analyzer's and the server's CSV
 * do (OWASP "CSV Injection", common practice): names and paths come from the scanned code.
 */
export function toCsv(header: readonly string[], records: readonly (readonly CsvValue[])[]): string {
  return [header, ...records].map((fields) => fields.map(csvField).join(',') + '\r\n').join('');
}

const FORMULA_START = /^[=+\-@\t\r]/;

function csvField(value: CsvValue): string {
  if (value === null || value === undefined) return '';
  const text = typeof value === 'string' && FORMULA_START.test(value) ? `'${value}` : String(value);
  return /[",\r\n]/.test(text) ? `"${text.replaceAll('"', '""')}"` : text;
}
