/**
 * Lines of code
 * =============
 * Marks which lines of a file hold code (at least one token), so that the lines of code of
 * any unit are one subtraction of prefix sums. Comments and blank lines are not code; the lines
 * inside a multi-line string or template are. One walk over the file's raw nodes marks the
 * line where each node starts and ends (every token starts or ends some node, except stray
 * keywords such as an `else` alone on its line — a difference of at most a line here and there).
 */
import { ts } from 'ts-morph';

export class CodeLines {
  /** prefix[i] = number of code lines among lines 1..i. */
  private readonly prefix: Uint32Array;

  constructor(sourceFile: ts.SourceFile) {
    const lineStarts = sourceFile.getLineStarts();
    const isCode = new Uint8Array(lineStarts.length + 1);
    const lineOf = (pos: number) => sourceFile.getLineAndCharacterOfPosition(pos).line + 1;
    const stack: ts.Node[] = [];
    ts.forEachChild(sourceFile, (c) => {
      stack.push(c);
    });
    while (stack.length > 0) {
      const node = stack.pop()!;
      // An empty node (an omitted expression) or the end-of-file marker holds no code.
      if (node.pos === node.end || node.kind === ts.SyntaxKind.EndOfFileToken) continue;
      const start = node.getStart(sourceFile);
      const first = lineOf(start);
      const last = lineOf(node.end - 1);
      isCode[first] = 1;
      isCode[last] = 1;
      if (isMultiLineLiteral(node)) for (let l = first; l <= last; l++) isCode[l] = 1;
      ts.forEachChild(node, (c) => {
        stack.push(c);
      });
    }
    this.prefix = new Uint32Array(isCode.length);
    for (let i = 1; i < isCode.length; i++) this.prefix[i] = this.prefix[i - 1] + isCode[i];
  }

  /** Code lines between two 1-based lines, both included. */
  count(line: number, endLine: number): number {
    return this.prefix[Math.min(endLine, this.prefix.length - 1)] - this.prefix[line - 1];
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

function isMultiLineLiteral(node: ts.Node): boolean {
  return (
    node.kind === ts.SyntaxKind.StringLiteral ||
    node.kind === ts.SyntaxKind.NoSubstitutionTemplateLiteral ||
    node.kind === ts.SyntaxKind.TemplateHead ||
    node.kind === ts.SyntaxKind.TemplateMiddle ||
    node.kind === ts.SyntaxKind.TemplateTail
  );
}
