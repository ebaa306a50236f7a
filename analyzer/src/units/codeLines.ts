/**
 * Lines of code
 * =============
 * Marks which lines of a file hold code (at least one token), so that the lines of code of any
 * unit are one subtraction of prefix sums. Comments and blank lines are not code; every line of
 * a multi-line template is, and so is each line a string continues onto after a backslash. One
 * pass over the characters with a small lexer (code, string, template, comment; comments are
 * skipped with the engine's own `indexOf`); `/` starts a regular expression unless it follows something that ends an
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
  const n = text.length;
  let lines = 1;
  for (let i = text.indexOf('\n'); i >= 0; i = text.indexOf('\n', i + 1)) lines++;
  const isCode = new Uint8Array(lines + 1);
  // Brace depth at which each open `${` returns to its template.
  const templates: number[] = [];
  let depth = 0;
  let line = 1;
  let lastSignificant = 0;
  let i = 0;
  // One loop with the strings and templates inline: this runs over every character of every file.
  while (i < n) {
    const c = text.charCodeAt(i);
    if (c === Ch.LineFeed) {
      line++;
      i++;
      continue;
    }
    if (c === Ch.Space || c === Ch.Tab || c === Ch.CarriageReturn || c === 0xfeff) {
      i++;
      continue;
    }
    if (c === Ch.Slash) {
      const next = text.charCodeAt(i + 1);
      if (next === Ch.Slash) {
        i = text.indexOf('\n', i);
        if (i < 0) i = n;
        continue;
      }
      if (next === Ch.Asterisk) {
        const close = text.indexOf('*/', i + 2);
        const end = close < 0 ? n : close + 2;
        for (let j = text.indexOf('\n', i + 2); j >= 0 && j < end; j = text.indexOf('\n', j + 1)) line++;
        i = end;
        continue;
      }
    }
    isCode[line] = 1;
    if (c === Ch.SingleQuote || c === Ch.DoubleQuote) {
      // A string ends at its quote, or unterminated at the line's end; `\` + newline continues it.
      i++;
      while (i < n) {
        const d = text.charCodeAt(i);
        if (d === Ch.Backslash) {
          const escaped = lineBreakLength(text, i + 1);
          if (escaped > 0) isCode[++line] = 1;
          i += 1 + Math.max(1, escaped);
        } else if (d === c) {
          i++;
          break;
        } else if (d === Ch.LineFeed) {
          break;
        } else {
          i++;
        }
      }
    } else if (c === Ch.Backtick || (c === Ch.CloseBrace && templates.length > 0 && templates[templates.length - 1] === depth)) {
      if (c === Ch.CloseBrace) {
        templates.pop();
        depth--;
      }
      // Template text runs to the closing backtick or an opening `${`; each of its lines is code.
      i++;
      while (i < n) {
        const d = text.charCodeAt(i);
        if (d === Ch.Backslash) {
          const escaped = lineBreakLength(text, i + 1);
          if (escaped > 0) isCode[++line] = 1;
          i += 1 + Math.max(1, escaped);
        } else if (d === Ch.Backtick) {
          i++;
          break;
        } else if (d === Ch.Dollar && text.charCodeAt(i + 1) === Ch.OpenBrace) {
          i += 2;
          templates.push(++depth);
          break;
        } else {
          if (d === Ch.LineFeed) isCode[++line] = 1;
          i++;
        }
      }
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

// Length of the line break at `i` (`\n`, `\r\n`; a lone `\r` is not one here), 0 when there is none.
function lineBreakLength(text: string, i: number): number {
  const c = text.charCodeAt(i);
  if (c === Ch.LineFeed) return 1;
  return c === Ch.CarriageReturn && text.charCodeAt(i + 1) === Ch.LineFeed ? 2 : 0;
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
