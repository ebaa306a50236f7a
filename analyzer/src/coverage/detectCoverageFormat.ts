/**
 * Which coverage format a text is in
 * ==================================
 * Istanbul JSON starts with `{` (after white space or a byte-order mark); an lcov tracefile
 * starts with one of its records (`TN:`, `SF:`, `VER:` …). Anything else is refused.
 */
import type { CoverageFormat } from './CoverageReport';
import { CoverageFormatError } from './CoverageFormatError';

const LCOV_FIRST_RECORD = /^(TN|SF|VER|FN|FNDA|FNF|FNH|DA|LF|LH|BRDA|BRF|BRH):|^end_of_record$/;

/** The format of a coverage report's text; throws `CoverageFormatError` when it is neither. */
export function detectCoverageFormat(text: string): CoverageFormat {
  const body = text.replace(/^\uFEFF/, '');
  const firstLine = body.split(/\r?\n/).map((l) => l.trim()).find((l) => l !== '');
  if (firstLine === undefined) throw new CoverageFormatError('the report is empty', 1);
  if (firstLine.startsWith('{')) return 'istanbul';
  if (LCOV_FIRST_RECORD.test(firstLine)) return 'lcov';
  throw new CoverageFormatError(`neither lcov nor Istanbul JSON (starts with "${firstLine.slice(0, 40)}")`, 1);
}
