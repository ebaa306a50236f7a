/**
 * Lines of code
 * =============
 * Marks which lines of a file hold code (at least one token), so that the lines of code of any
 * unit are one subtraction of prefix sums. Comments and blank lines are not code; every line of
 * a multi-line template is. One pass over the characters with a small lexer (code, string,
 * template, comment); `/` starts a regular expression unless it follows something that ends an
 * operand — the usual heuristic, which can misjudge a line in rare code such as `return /re/`,
 * and then only by a line.
 */
import type { ts } from '../compiler';

const enum Ch {
  Tab = 9, LineFeed = 10, CarriageReturn = 13, Space = 32, DoubleQuote = 34, Dollar = 36, SingleQuote = 39,
  CloseParen = 41, Asterisk = 42, Slash = 47, OpenBracket = 91, Backslash = 92, CloseBracket = 93,
  Backtick = 96, OpenBrace = 123, CloseBrace = 125,
}

export class CodeLines {
  /** prefix[i] = number of code lines among lines 1..i. */
  private readonly prefix: Uint32Array;

  constructor(sourceFile: ts.SourceFile) {
    const isCode = markCodeLines(sourceFile.text);
    this.prefix = new Uint32Array(isCode.length);
    for (let i = 1; i < isCode.length; i++) this.prefix[i] = this.prefix[i - 1] + isCode[i];
  }

  /** Code lines between two 1-based lines, both included. */
  count(line: number, endLine: number): number {
    return this.prefix[Math.min(endLine, this.prefix.length - 1)] - this.prefix[Math.max(0, line - 1)];
  }

  /** Code lines covered by any of the given [line, endLine] ranges (overlaps counted once). */
  countUnion(ranges: [number, number][]): number {
    const sorted = [...ranges].sort((a, b) => a[0] - b[0]);
    let total = 0;
    let [from, to] = [0, -1];
    for (const [line, endLine] of sorted) {
      if (line > to) {
        if (to >= from && to > 0) total += this.count(from, to);
        [from, to] = [line, endLine];
      } else if (endLine > to) {
        to = endLine;
      }
    }
    if (to >= from && to > 0) total += this.count(from, to);
    return total;
  }
}

/** isCode[line] = 1 for each 1-based line holding code. */
function markCodeLines(text: string): Uint8Array {
  let lines = 1;
  for (let i = 0; i < text.length; i++) if (text.charCodeAt(i) === Ch.LineFeed) lines++;
  const isCode = new Uint8Array(lines + 1);
  // Brace depth at which each open `${` returns to its template.
  const templates: number[] = [];
  let depth = 0;
  let line = 1;
  let lastSignificant = 0;
  let i = 0;
  const n = text.length;
  const newline = () => {
    line++;
  };
  while (i < n) {
    const c = text.charCodeAt(i);
    if (c === Ch.LineFeed) {
      newline();
      i++;
      continue;
    }
    if (c === Ch.Space || c === Ch.Tab || c === Ch.CarriageReturn || c === 0xfeff) {
      i++;
      continue;
    }
    if (c === Ch.Slash && text.charCodeAt(i + 1) === Ch.Slash) {
      while (i < n && text.charCodeAt(i) !== Ch.LineFeed) i++;
      continue;
    }
    if (c === Ch.Slash && text.charCodeAt(i + 1) === Ch.Asterisk) {
      i += 2;
      while (i < n && !(text.charCodeAt(i) === Ch.Asterisk && text.charCodeAt(i + 1) === Ch.Slash)) {
        if (text.charCodeAt(i) === Ch.LineFeed) newline();
        i++;
      }
      i += 2;
      continue;
    }
    isCode[line] = 1;
    if (c === Ch.SingleQuote || c === Ch.DoubleQuote) {
      i = skipString(text, i, c, () => {
        newline();
        isCode[line] = 1;
      });
    } else if (c === Ch.Backtick || (c === Ch.CloseBrace && templates.length > 0 && templates[templates.length - 1] === depth)) {
      if (c === Ch.CloseBrace) {
        templates.pop();
        depth--;
      }
      i = skipTemplateText(text, i + 1, () => {
        newline();
        isCode[line] = 1;
      });
      if (text.charCodeAt(i - 1) === Ch.OpenBrace) templates.push(++depth);
    } else if (c === Ch.Slash && !endsOperand(lastSignificant)) {
      i = skipRegex(text, i);
    } else {
      if (c === Ch.OpenBrace) depth++;
      else if (c === Ch.CloseBrace) depth--;
      i++;
    }
    lastSignificant = text.charCodeAt(i - 1);
  }
  return isCode;
}

function skipString(text: string, i: number, quote: number, onNewline: () => void): number {
  i++;
  while (i < text.length) {
    const c = text.charCodeAt(i);
    if (c === Ch.Backslash) {
      if (text.charCodeAt(i + 1) === Ch.LineFeed) onNewline();
      i += 2;
    } else if (c === quote) {
      return i + 1;
    } else if (c === Ch.LineFeed) {
      return i; // an unterminated string ends at the line's end
    } else {
      i++;
    }
  }
  return i;
}

// From just after "`" or "}", to just after the closing "`" or an opening "${".
function skipTemplateText(text: string, i: number, onNewline: () => void): number {
  while (i < text.length) {
    const c = text.charCodeAt(i);
    if (c === Ch.Backslash) i += 2;
    else if (c === Ch.Backtick) return i + 1;
    else if (c === Ch.Dollar && text.charCodeAt(i + 1) === Ch.OpenBrace) return i + 2;
    else {
      if (c === Ch.LineFeed) onNewline();
      i++;
    }
  }
  return i;
}

function skipRegex(text: string, i: number): number {
  let inClass = false;
  for (i++; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === Ch.LineFeed) return i;
    if (c === Ch.Backslash) i++;
    else if (c === Ch.OpenBracket) inClass = true;
    else if (c === Ch.CloseBracket) inClass = false;
    else if (c === Ch.Slash && !inClass) return i + 1;
  }
  return i;
}

// After an identifier, a number, a closing bracket or a string, `/` divides.
function endsOperand(c: number): boolean {
  return (
    (c >= 48 && c <= 57) || (c >= 65 && c <= 90) || (c >= 97 && c <= 122) || c === 95 || c === Ch.Dollar ||
    c === Ch.CloseParen || c === Ch.CloseBracket || c === Ch.CloseBrace || c === Ch.SingleQuote || c === Ch.DoubleQuote || c === Ch.Backtick || c > 127
  );
}
