import fc from 'fast-check';
import { countDecisions } from '../decisions/countDecisions';
import { cyclomaticOf } from '../metrics/cyclomatic';
import type { CountingSettings } from '../model/CountingSettings';
import { buildFlowGraph } from './buildFlowGraph';
import { fromCompactGraph, toCompactGraph } from './compactGraph';
import { collectUnits } from './fixtures/collectUnits';
import { programArbitraries } from './fixtures/programArbitrary';
import { ProgramRenderer } from './fixtures/renderProgram';
import { validateFlowGraph } from './validateFlowGraph';

const settingsArbitrary: fc.Arbitrary<CountingSettings> = fc.record({
  switch: fc.constantFrom('cases' as const, 'one' as const),
  optionalChaining: fc.boolean(),
  defaultValues: fc.boolean(),
  limit: fc.constant(10),
});

/** A whole program: top-level code, then `main` with a destructured, defaulted parameter. */
const programArbitrary = fc
  .record({ top: programArbitraries.block, body: programArbitraries.block, d: programArbitraries.expr })
  .map(({ top, body, d }) => {
    const r = new ProgramRenderer();
    return `${r.topLevel(top).join('\n')}\nfunction main(p0, { q = ${r.expr(d)} } = {}) {\n${r.functionBody(body).join('\n')}\n}\n`;
  });

/** Σ V(G) from the graphs and Σ decisions from the syntax tree over every unit of a program. */
function totals(text: string, settings: CountingSettings): { v: number; decisions: number; units: number } {
  const { sourceFile, units, syntaxErrors } = collectUnits(text);
  expect(syntaxErrors).toEqual([]);
  let v = 0;
  let decisions = 0;
  for (const unit of units) {
    v += cyclomaticOf(buildFlowGraph(unit, sourceFile, settings)).strict;
    decisions += countDecisions(unit, sourceFile, settings).total;
  }
  return { v, decisions, units: units.length };
}

describe('buildFlowGraph on generated programs', () => {
  it('should give every unit a sound graph with V(G) = decisions on the syntax tree + 1', () => {
    // McCabe 1976, IEEE TSE SE-2(4) / NIST SP 500-235 §4.1: with binary decisions v = π + 1.
    fc.assert(
      fc.property(programArbitrary, settingsArbitrary, (text, settings) => {
        const { sourceFile, units, syntaxErrors } = collectUnits(text);
        expect(syntaxErrors).toEqual([]);
        for (const unit of units) {
          const graph = buildFlowGraph(unit, sourceFile, settings);
          expect(validateFlowGraph(graph)).toEqual([]);
          const v = cyclomaticOf(graph);
          const count = countDecisions(unit, sourceFile, settings);
          expect(v.components).toBe(1);
          expect(v.strict).toBe(count.total + 1);
          expect(v.strict).toBeGreaterThanOrEqual(1);
          expect(graph.decisions.length).toBe(count.total);
          // JSON text equality (key order included) is exact for plain data and far cheaper than a deep compare.
          expect(JSON.stringify(fromCompactGraph(toCompactGraph(graph)))).toBe(JSON.stringify(graph));
        }
      }),
      { numRuns: 1000 },
    );
  });

  it('should add exactly 1 to ΣV and 0 to the decisions when a statement is extracted into a function', () => {
    // Product caution (docs) and McCabe 1976 §1.6 additivity: each new function is a new component (+1),
    // its decisions move with the code (DERIVED).
    fc.assert(
      fc.property(programArbitraries.block, fc.nat(), settingsArbitrary, (body, pick, settings) => {
        fc.pre(body.length > 0);
        const statements = new ProgramRenderer().functionBody(body);
        const k = pick % statements.length;
        const before = `function main(p) {\n${statements.join('\n')}\n}\n`;
        const inPlace = statements.map((s, i) => (i === k ? 'extracted();' : s));
        const after = `function main(p) {\n${inPlace.join('\n')}\n}\nfunction extracted() {\n${statements[k]}\n}\n`;
        const a = totals(before, settings);
        const b = totals(after, settings);
        expect(b.units).toBe(a.units + 1);
        expect(b.v).toBe(a.v + 1);
        expect(b.decisions).toBe(a.decisions);
      }),
      { numRuns: 400 },
    );
  });
});
