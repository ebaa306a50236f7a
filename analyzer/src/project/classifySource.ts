import type { SkippedFile } from '../model';

/** Longest line a hand-written source file plausibly has; longer means minified or bundled. */
export const MAX_LINE_LENGTH = 1000;
/** How many leading lines are searched for a `@generated` marker. */
const MARKER_LINES = 10;

/**
 * Whether a file should be skipped before parsing, and why: generated files (a `@generated`
 * marker near the top — common practice among code generators) and minified files (a line over
 * 1,000 characters). Hand-written code is measured; machine-written code would only add noise.
 */
export function classifySource(text: string, maxLineLength = MAX_LINE_LENGTH): Pick<SkippedFile, 'reason' | 'detail'> | undefined {
  // 0 (or less) turns the minified check off, e.g. to measure a large bundled file on purpose.
  const limit = maxLineLength > 0 ? maxLineLength : Number.POSITIVE_INFINITY;
  const marker = markerLine(text);
  // Line by line, the first finding wins; on the marker's own line the marker does.
  const long = text.length > limit ? firstLongLine(text, limit, marker ?? Number.POSITIVE_INFINITY) : undefined;
  if (long) return { reason: 'minified', detail: `line ${long.line} has ${long.length} characters (more than ${limit})` };
  if (marker !== undefined) return { reason: 'generated', detail: `a @generated marker on line ${marker}` };
  return undefined;
}

/** The line of a `@generated` marker within the first lines, if any. */
function markerLine(text: string): number | undefined {
  const at = text.indexOf('@generated');
  if (at < 0) return undefined;
  let line = 1;
  for (let i = text.indexOf('\n'); i >= 0 && i < at; i = text.indexOf('\n', i + 1)) {
    if (++line > MARKER_LINES) return undefined;
  }
  return line;
}

/** The first line before `beforeLine` longer than `limit` characters (a `\r` counts), if any. */
function firstLongLine(text: string, limit: number, beforeLine: number): { line: number; length: number } | undefined {
  let lineStart = 0;
  for (let line = 1; line < beforeLine && lineStart <= text.length; line++) {
    let lineEnd = text.indexOf('\n', lineStart);
    if (lineEnd === -1) lineEnd = text.length;
    if (lineEnd - lineStart > limit) return { line, length: lineEnd - lineStart };
    lineStart = lineEnd + 1;
  }
  return undefined;
}
