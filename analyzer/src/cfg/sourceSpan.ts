import type { ts } from '../compiler';
import type { SourceSpan } from '../model/FlowGraph';

/** Longest condition text kept on a decision. */
export const MAX_DECISION_TEXT = 120;

/**
 * The 1-based span of `[start, end)`: `line/column` is the first character, `endLine/endColumn`
 * the position just after the last one (exclusive end, as ESLint reports it).
 */
export function spanOf(sourceFile: ts.SourceFile, start: number, end: number): SourceSpan {
  const from = sourceFile.getLineAndCharacterOfPosition(start);
  const to = sourceFile.getLineAndCharacterOfPosition(end);
  return { line: from.line + 1, column: from.character + 1, endLine: to.line + 1, endColumn: to.character + 1 };
}

function isSpace(code: number): boolean {
  return code === 32 || (code >= 9 && code <= 13) || code === 0xa0 || code === 0xfeff || code === 0x2028 || code === 0x2029;
}

/** Source text of `[start, end)` with whitespace runs collapsed to one space, cut to 120 characters with an ellipsis. */
export function collapsedText(text: string, start: number, end: number): string {
  // Whole runs of non-space characters are copied at once, not character by character.
  let out = '';
  let run = -1;
  for (let i = start; i <= end; i++) {
    if (i < end && !isSpace(text.charCodeAt(i))) {
      if (run < 0) run = i;
      continue;
    }
    if (run < 0) continue;
    out = out === '' ? text.slice(run, i) : `${out} ${text.slice(run, i)}`;
    run = -1;
    if (out.length > MAX_DECISION_TEXT) return `${out.slice(0, MAX_DECISION_TEXT - 1)}…`;
  }
  return out;
}
