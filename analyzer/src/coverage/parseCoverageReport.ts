/**
 * Reading a coverage report of either format
 * ==========================================
 * Detects the format and hands the text to the lcov or Istanbul reader; a JSON syntax error
 * becomes a `CoverageFormatError` like every other malformed input.
 */
import type { CoverageReport } from './CoverageReport';
import { CoverageFormatError } from './CoverageFormatError';
import { detectCoverageFormat } from './detectCoverageFormat';
import { parseIstanbulJson } from './parseIstanbulJson';
import { parseLcov } from './parseLcov';

/** Parses lcov or Istanbul JSON text, whichever it is. */
export function parseCoverageReport(text: string): CoverageReport {
  const body = text.replace(/^\uFEFF/, '');
  if (detectCoverageFormat(body) === 'lcov') return parseLcov(body);
  let json: unknown;
  try {
    json = JSON.parse(body);
  } catch (error) {
    throw new CoverageFormatError(`not valid JSON (${(error as Error).message})`);
  }
  return parseIstanbulJson(json);
}
