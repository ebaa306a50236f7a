import { ts } from 'ts-morph';
import { DEFAULT_SETTINGS, ESLINT_COMPARABLE_SETTINGS } from '../model/CountingSettings';
import { buildFlowGraph } from './buildFlowGraph';
import { analyzeSnippet } from './fixtures/analyzeSnippet';
import { FlowGraphError } from './FlowGraphError';

/** V(G) of each named unit of a snippet. */
function vOf(code: string, settings = DEFAULT_SETTINGS): Record<string, number> {
  const out: Record<string, number> = {};
  for (const [name, unit] of analyzeSnippet(code, settings)) {
    expect(unit.strict).toBe(unit.count.total + 1);
    out[name] = unit.strict;
  }
  return out;
}

describe('unit boundaries', () => {
  it('should not enter nested functions, arrows or methods from the parent', () => {
    expect(vOf('function f() { const g = () => { if (a) b(); }; function h() { while (c) d(); } return { m() { if (e) f(); } }; }'))
      .toEqual({ 'top-level': 1, f: 1, 'arrow@1': 2, h: 2, m: 2 });
  });

  it('should count class decorators, extends and computed names in the unit that defines the class', () => {
    const code = 'function f() { @dec(a && b) class A extends (x ?? Y) { [k || "m"]() { if (z) q(); } @prop(p ? 1 : 2) field = 1; } }';
    expect(vOf(code)).toEqual({ 'top-level': 1, f: 5, 'A.field': 1, 'arrow@1': 2 });
  });

  it('should give an object-literal method computed name to the parent and the body to the method', () => {
    expect(vOf('function f() { return { [a ?? "k"]() { if (b) c(); } }; }')).toEqual({ 'top-level': 1, f: 2, 'arrow@1': 2 });
  });

  it('should give default parameter values to their function (the decision only with defaultValues)', () => {
    const code = 'function f(a = b || c) { return (x = y ?? z) => x; }';
    expect(vOf(code)).toEqual({ 'top-level': 1, f: 2, 'arrow@1': 2 });
    expect(vOf(code, ESLINT_COMPARABLE_SETTINGS)).toEqual({ 'top-level': 1, f: 3, 'arrow@1': 3 });
  });

  it('should treat field initializers, static blocks and constructors as units', () => {
    expect(vOf('class K { x = a ? 1 : 2; y; static { if (c) d(); } constructor(p = 1) { if (p) q(); } }', ESLINT_COMPARABLE_SETTINGS))
      .toEqual({ 'top-level': 1, 'K.x': 2, 'K.y': 1, 'K.static': 2, 'K.constructor': 3 });
  });

  it('should build arrow expression bodies and count destructuring defaults in every position', () => {
    const code = 'const g = ({ a = 1 }, [b = 2] = []) => { for (const { c = 3 } of xs) {} for ([d = 4] of ys) {} ({ e = 5 } = o); [f = 6] = arr; try {} catch ({ g = 7 }) {} return a; };';
    expect(vOf(code, ESLINT_COMPARABLE_SETTINGS)).toEqual({ 'top-level': 1, 'arrow@1': 1 + 8 + 2 + 1 });
    expect(vOf('const h = (x) => x ? 1 : 2;')).toEqual({ 'top-level': 1, 'arrow@1': 2 });
  });

  it('should run namespace bodies as top-level code and skip type-only and ambient code', () => {
    const code = 'namespace N { if (a) b(); }\ndeclare namespace M { const q: number; }\ndeclare function d(x: number): void;\ninterface I { m(): void }\ntype T = A extends B ? C : D;\nlet v: T extends U ? 1 : 2 = w || z;';
    // A declared function is still a unit (the caller decides whether to report it): no body, V = 1.
    expect(vOf(code)).toEqual({ 'top-level': 3, d: 1 });
  });

  it('should refuse a node that is no unit with a prefixed typed error', () => {
    const sourceFile = ts.createSourceFile('a.ts', 'x + 1;', ts.ScriptTarget.Latest, true);
    const expression = (sourceFile.statements[0] as ts.ExpressionStatement).expression;
    expect(() => buildFlowGraph(expression, sourceFile, DEFAULT_SETTINGS)).toThrow(FlowGraphError);
    expect(() => buildFlowGraph(expression, sourceFile, DEFAULT_SETTINGS)).toThrow(/^analyzer\/cfg: a BinaryExpression is not a function unit$/);
  });

  it('should give a body-less function (an overload signature) V = 1', () => {
    expect(vOf('function o(a: string): void;')).toEqual({ 'top-level': 1, o: 1 });
  });
});
