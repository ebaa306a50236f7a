import { ts } from 'ts-morph';
import { buildFlowGraph } from '../cfg/buildFlowGraph';
import { DEFAULT_SETTINGS, ESLINT_COMPARABLE_SETTINGS } from '../model';
import type { CountingSettings } from '../model';
import { essentialComplexity } from './essentialComplexity';

/** ev(G) and V(G) of the first statement of `source`, a function declaration. */
function measure(source: string, settings: CountingSettings = DEFAULT_SETTINGS): { ev: number; v: number } {
  const sourceFile = ts.createSourceFile('unit.ts', source, ts.ScriptTarget.Latest, true);
  const graph = buildFlowGraph(sourceFile.statements[0], sourceFile, settings);
  return { ev: essentialComplexity(graph).essential, v: graph.edges.length - graph.blocks.length + 2 };
}

describe('essentialComplexity on graphs built from source', () => {
  // McCabe 1976 (reference-checks 1.12) / NIST SP 500-235 §10.2 (2.8): structured code has ev = 1.
  const structured: [string, string][] = [
    ['if-else', 'function f(a) { if (a) x(); else y(); }'],
    ['guard clauses', 'function f(a, b) { if (!a) return 1; if (!b) return 2; return 3; }'],
    ['for with an if-else body', 'function f(n) { for (let i = 0; i < n; i++) { if (i % 2) x(); else y(); } }'],
    ['for-of and for-in', 'function f(xs, o) { for (const x of xs) use(x); for (const k in o) use(k); }'],
    ['do-while', 'function f() { do { x(); } while (more()); }'],
    ['continue at the end of a test', 'function f(a) { while (a()) { if (skip()) continue; x(); } }'],
    ['compound conditions', 'function f(a, b, c) { if (a && b || c) x(); else y(); while (a && !b) z(); }'],
    ['switch without fall-through', "function f(k) { switch (k) { case 'a': x(); break; case 'b': y(); break; default: z(); } }"],
    ['shared case labels', 'function f(k) { switch (k) { case 1: case 2: x(); break; default: z(); } }'],
    ['operators in values', "function f(a, b) { const v = a ? b : 0; const w = a ?? b; let u = v || w; u ||= 1; return u; }"],
    ['try-catch', 'function f() { try { x(); } catch (e) { y(); } }'],
  ];
  it.each(structured)('%s has ev = 1', (_name, source) => {
    const { ev, v } = measure(source);
    expect(v).toBeGreaterThan(1);
    expect(ev).toBe(1);
  });

  it('should agree with the hand-built reference-checks 2.9 example', () => {
    // reference-checks 2.9 (DERIVED from NIST SP 500-235 §10.2): v = 3, ev = 3.
    expect(measure('function f() { while (c1()) { if (c2()) break; body(); } }')).toEqual({ v: 3, ev: 3 });
  });

  // Product definition: early return inside a loop, labelled break/continue and throw leave
  // irreducible structure (McCabe 1976, reference-checks 1.11: branching out of a loop).
  const unstructured: [string, string][] = [
    ['return inside a loop', 'function f(xs) { for (const x of xs) { if (x) return x; } return null; }'],
    ['throw inside a loop', 'function f(a) { while (a()) { if (bad()) throw new Error(); x(); } }'],
    ['labelled break', 'function f(n) { outer: for (let i = 0; i < n; i++) { for (let j = 0; j < n; j++) { if (hit(i, j)) break outer; } } }'],
    ['labelled continue', 'function f(n) { outer: for (let i = 0; i < n; i++) { for (let j = 0; j < n; j++) { if (hit(i, j)) continue outer; x(); } } }'],
    ['switch with fall-through', 'function f(k) { switch (k) { case 1: x(); case 2: y(); break; } }'],
    ['return out of a nested if', 'function f(a, b) { if (a) { if (b) return; x(); } y(); }'],
  ];
  it.each(unstructured)('%s has 2 < ev ≤ V', (_name, source) => {
    const { ev, v } = measure(source);
    expect(ev).toBeGreaterThan(2);
    expect(ev).toBeLessThanOrEqual(v);
  });

  it('should count optional chaining and default values as structured when they are decisions', () => {
    const source = 'function f({ a = 1 } = {}, o) { return o?.p?.q ?? a; }';
    const { ev, v } = measure(source, ESLINT_COMPARABLE_SETTINGS);
    expect(v).toBeGreaterThan(3);
    expect(ev).toBe(1);
  });
});
