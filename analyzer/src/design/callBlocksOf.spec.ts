import { ts } from 'ts-morph';
import { buildFlowGraph } from '../cfg/buildFlowGraph';
import { DEFAULT_SETTINGS } from '../model';
import { callBlocksOf } from './callBlocksOf';

/** The graph of the snippet's first function and the 1-based position of each `marker(` call. */
function graphWithSites(text: string, marker: string) {
  const sourceFile = ts.createSourceFile('sites.ts', text, ts.ScriptTarget.Latest, true);
  const fn = sourceFile.statements.find(ts.isFunctionDeclaration)!;
  const sites: { line: number; column: number }[] = [];
  for (let at = text.indexOf(`${marker}(`); at >= 0; at = text.indexOf(`${marker}(`, at + 1)) {
    const { line, character } = sourceFile.getLineAndCharacterOfPosition(at);
    sites.push({ line: line + 1, column: character + 1 });
  }
  return { graph: buildFlowGraph(fn, sourceFile, DEFAULT_SETTINGS), sites, sourceFile };
}

describe('callBlocksOf', () => {
  it('should pick the innermost block when an operator splits a statement', () => {
    const { graph, sites } = graphWithSites('function f(a) { x = a && g(); }', 'g');
    const [block] = [...callBlocksOf(graph, sites)];
    // The statement's block spans `x = a && g()`; the right operand has its own block.
    expect(graph.blocks[block].span).toEqual({ line: 1, column: sites[0].column, endLine: 1, endColumn: sites[0].column + 'g()'.length });
  });

  it('should map calls in both branches to two different blocks and repeated calls to one', () => {
    const { graph, sites } = graphWithSites('function f(c) {\n  if (c) { g(); g(); }\n  else { g(); }\n}', 'g');
    expect(sites).toHaveLength(3);
    const blocks = callBlocksOf(graph, sites);
    expect(blocks.size).toBe(2);
    for (const b of blocks) expect(graph.blocks[b].kind).toBe('code');
  });

  it('should map a call in a loop test to the decision block', () => {
    const { graph, sites } = graphWithSites('function f() { while (g()) { } }', 'g');
    const [block] = [...callBlocksOf(graph, sites)];
    expect(graph.blocks[block].kind).toBe('decision');
  });

  it('should name no block for a position outside every block', () => {
    const { graph, sites } = graphWithSites('function f() { g(); }', 'g');
    expect(callBlocksOf(graph, [{ line: 9, column: 1 }]).size).toBe(0);
    // The end column is exclusive: the position just after `g();` is outside its block.
    const span = graph.blocks[[...callBlocksOf(graph, sites)][0]].span!;
    expect(callBlocksOf(graph, [{ line: 1, column: span.endColumn - 1 }]).size).toBe(1);
    expect(callBlocksOf(graph, [{ line: 1, column: span.endColumn }]).size).toBe(0);
  });
});
