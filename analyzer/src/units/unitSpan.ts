import { ts } from '../compiler';

/**
 * Where a unit starts and ends: 1-based lines of its first and last character, leading
 * comments and decorators excluded (a decorated method starts at its first modifier or name).
 */
export function unitSpan(node: ts.Node, sourceFile: ts.SourceFile): { start: number; line: number; endLine: number } {
  let start: number;
  if (ts.isSourceFile(node)) {
    start = node.statements.length ? node.statements[0].getStart(sourceFile) : 0;
  } else {
    const decorators = ts.canHaveDecorators(node) ? ts.getDecorators(node) : undefined;
    start = decorators?.length ? firstAfterDecorators(node, sourceFile) : node.getStart(sourceFile);
  }
  const end = ts.isSourceFile(node) ? Math.max(start, lastStatementEnd(node)) : node.end;
  const line = sourceFile.getLineAndCharacterOfPosition(start).line + 1;
  const endLine = sourceFile.getLineAndCharacterOfPosition(Math.max(start, end - 1)).line + 1;
  return { start, line, endLine };
}

function lastStatementEnd(sourceFile: ts.SourceFile): number {
  const last = sourceFile.statements[sourceFile.statements.length - 1];
  return last ? last.end : 0;
}

// A decorated member starts at its first modifier (`static`, `async`…) or, without one, its name.
function firstAfterDecorators(node: ts.Node, sourceFile: ts.SourceFile): number {
  const modifier = ts.canHaveModifiers(node) ? ts.getModifiers(node)?.[0] : undefined;
  const name = (node as { name?: ts.Node }).name;
  return (modifier ?? name ?? node).getStart(sourceFile);
}
