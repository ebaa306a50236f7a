import fc from 'fast-check';
import { ts } from 'ts-morph';
import { buildFlowGraph } from '../cfg/buildFlowGraph';
import { collectUnits } from '../cfg/fixtures/collectUnits';
import { programArbitraries } from '../cfg/fixtures/programArbitrary';
import { ProgramRenderer } from '../cfg/fixtures/renderProgram';
import { essentialComplexity } from '../essential/essentialComplexity';
import { DEFAULT_SETTINGS, ESLINT_COMPARABLE_SETTINGS } from '../model';
import { basisCoverageGap } from './basisCoverageGap';
import { basisPaths } from './basisPaths';
import { describePath } from './describePath';
import { pathRank } from './pathRank';

describe('basis paths of graphs built from source', () => {
  it('should give the JavaScript euclid three paths and a readable checklist', () => {
    // NIST SP 500-235 §2.1/§2.4 (reference-checks 2.2): euclid has v = 3, hence 3 basis paths;
    // the baseline skips the swap and the loop, like the published walk for input (4, 2).
    const source = [
      'function euclid(m, n) {',
      '  let r;',
      '  if (n > m) {',
      '    r = m; m = n; n = r;',
      '  }',
      '  r = m % n;',
      '  while (r !== 0) {',
      '    m = n; n = r; r = m % n;',
      '  }',
      '  return n;',
      '}',
    ].join('\n');
    const sourceFile = ts.createSourceFile('euclid.ts', source, ts.ScriptTarget.Latest, true);
    const graph = buildFlowGraph(sourceFile.statements[0], sourceFile, DEFAULT_SETTINGS);
    const paths = basisPaths(graph);
    expect(paths).toHaveLength(3);
    expect(pathRank(graph, paths)).toBe(3);
    expect(paths.map((p) => describePath(graph, p))).toEqual([
      ['line 3: if (n > m) → false', 'line 7: while (r !== 0) → leave loop'],
      ['line 3: if (n > m) → true', 'line 7: while (r !== 0) → leave loop'],
      ['line 3: if (n > m) → false', 'line 7: while (r !== 0) → enter loop', 'line 7: while (r !== 0) → leave loop'],
    ]);
  });

  it('should let the baseline complete a try block and match the first case', () => {
    const source = "function f(k) { try { a(); } catch (e) { b(); } switch (k) { case 'air': fly(); break; default: drive(); } }";
    const sourceFile = ts.createSourceFile('f.ts', source, ts.ScriptTarget.Latest, true);
    const graph = buildFlowGraph(sourceFile.statements[0], sourceFile, DEFAULT_SETTINGS);
    expect(describePath(graph, basisPaths(graph)[0])).toEqual(['line 1: try … catch (e) → completes', "line 1: case 'air' → matches"]);
  });

  it('should hold for every unit of generated programs: rank = paths = V minus what dead code hides, 1 ≤ ev ≤ V, ev ≠ 2', () => {
    // NIST SP 500-235 §6 and §10.2 (reference-checks 2.8, 2.10, 9.5, 9.6).
    const program = fc.record({ top: programArbitraries.block, body: programArbitraries.block }).map(({ top, body }) => {
      const r = new ProgramRenderer();
      return `${r.topLevel(top).join('\n')}\nfunction main(p0) {\n${r.functionBody(body).join('\n')}\n}\n`;
    });
    fc.assert(
      fc.property(program, fc.boolean(), (text, all) => {
        const { sourceFile, units } = collectUnits(text);
        for (const unit of units) {
          const graph = buildFlowGraph(unit, sourceFile, all ? ESLINT_COMPARABLE_SETTINGS : DEFAULT_SETTINGS);
          const v = graph.edges.length - graph.blocks.length + 2;
          const gap = basisCoverageGap(graph);
          const hidden = gap.unreachableDecisions.length + gap.trappedDecisions.length + gap.trappedOutcomes.length;
          const paths = basisPaths(graph);
          expect(paths).toHaveLength(gap.exitReachable ? v - hidden : 0);
          expect(pathRank(graph, paths)).toBe(paths.length);
          const { essential } = essentialComplexity(graph);
          expect(essential).toBeGreaterThanOrEqual(1);
          expect(essential).toBeLessThanOrEqual(v);
          expect(essential).not.toBe(2);
        }
      }),
      { numRuns: 150 },
    );
  });
});
