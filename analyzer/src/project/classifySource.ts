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
  let lineStart = 0;
  for (let lineNo = 1; lineStart <= text.length; lineNo++) {
    let lineEnd = text.indexOf('\n', lineStart);
    if (lineEnd === -1) lineEnd = text.length;
    if (lineNo <= MARKER_LINES && text.slice(lineStart, lineEnd).includes('@generated')) {
      return { reason: 'generated', detail: `a @generated marker on line ${lineNo}` };
    }
    if (lineEnd - lineStart > limit) {
      return { reason: 'minified', detail: `line ${lineNo} has ${lineEnd - lineStart} characters (more than ${limit})` };
    }
    lineStart = lineEnd + 1;
  }
  return undefined;
}
