import { ts } from 'ts-morph';
import { DEFAULT_SETTINGS, ESLINT_COMPARABLE_SETTINGS, type CountingSettings } from '../model/CountingSettings';
import { countDecisions } from './countDecisions';

/** Count for the first function of `code`. */
function count(code: string, settings: CountingSettings = DEFAULT_SETTINGS) {
  const sourceFile = ts.createSourceFile('a.ts', code, ts.ScriptTarget.Latest, true);
  return countDecisions(sourceFile.statements[0], sourceFile, settings);
}

describe('countDecisions', () => {
  it.each([
    ['if (a) x(); else if (b) y(); else z();', { if: 2 }],
    ['return a ? b : c;', { conditional: 1 }],
    ['switch (x) { case 1: case 2: a(); default: b(); }', { case: 2 }],
    ['for (;;) {} for (const x of xs) {} for (const k in o) {} while (a) {} do {} while (b);', { for: 1, 'for-of': 1, 'for-in': 1, while: 1, 'do-while': 1 }],
    ['try { a(); } catch { b(); } finally { c(); } try { d(); } finally { e(); }', { catch: 1 }],
    ['const v = a && b || c ?? d;', { and: 1, or: 1, nullish: 1 }],
    ['o.a &&= 1; o.b ||= 2; o.c ??= 3;', { 'and-assign': 1, 'or-assign': 1, 'nullish-assign': 1 }],
    ['label: { break label; } for (;;) { continue; } throw e; return;', { for: 1 }],
  ])('should count %s', (body, byKind) => {
    // Watson & McCabe, NIST SP 500-235 §4 (from memory) and ESLint 9 complexity (reference-checks §8,
    // VERIFIED-TEXT): +1 per if, ?:, case, loop, catch, &&, ||, ??, logical assignment; else,
    // default:, try, finally, break, continue, throw and return add nothing.
    const result = count(`function f() { ${body} }`);
    expect(result.byKind).toEqual(byKind);
    expect(result.total).toBe(Object.values(byKind).reduce((a, b) => a + b, 0));
  });

  it('should count ?. and default values only under their settings', () => {
    const code = 'function f(p = 1, { q = 2, r: [s = 3] } = {}) { ({ t = 4 } = o); [u = 5] = arr; for ([w = 6] of xs) {} return a?.b?.[c]?.(d); }';
    expect(count(code).total).toBe(1);
    const eslint = count(code, ESLINT_COMPARABLE_SETTINGS);
    expect(eslint.byKind).toEqual({ 'default-value': 7, 'optional-chain': 3, 'for-of': 1 });
  });

  it('should list non-default cases per switch in source order, empty switches included', () => {
    const code = 'function f() { switch (a) { case 1: switch (b) { default: } case 2: } switch (c) { case 3: case 4: case 5: } }';
    expect(count(code).casesPerSwitch).toEqual([2, 0, 3]);
  });

  it('should not count inside nested units but count class definition parts', () => {
    const code = 'function f() { const g = () => a && b; class K extends (c ?? D) { [e || "m"]() { return f ? 1 : 2; } x = g && h; static { if (i) j(); } } }';
    expect(count(code).byKind).toEqual({ nullish: 1, or: 1 });
  });

  it('should count the top-level code of a file without its functions', () => {
    const sourceFile = ts.createSourceFile('a.ts', 'if (a) b();\nfunction f() { if (c) d(); }\nconst x = e ?? f;', ts.ScriptTarget.Latest, true);
    expect(countDecisions(sourceFile, sourceFile, DEFAULT_SETTINGS).byKind).toEqual({ if: 1, nullish: 1 });
  });
});
