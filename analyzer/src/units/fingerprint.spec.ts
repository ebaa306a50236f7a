import { ts } from 'ts-morph';
import { fingerprint } from './fingerprint';

function printOf(code: string): string {
  const sf = ts.createSourceFile('a.ts', code, ts.ScriptTarget.Latest, true);
  const fn = sf.statements[0];
  return fingerprint(fn, (n) => n !== fn && (ts.isFunctionLike(n) || ts.isArrowFunction(n)));
}

describe('fingerprint', () => {
  it('should ignore whitespace, comments and the names of locals', () => {
    const a = printOf('function f(order) { const total = order.total; return total > 10; }');
    const b = printOf('function f(o) {\n  // the sum\n  const t = o.total;\n  return t > 10;\n}');
    expect(a).toBe(b);
  });

  it('should change when behaviour changes: an operator, a literal, a property or a called function', () => {
    const base = printOf('function f(o) { return g(o.total) > 10; }');
    expect(printOf('function f(o) { return g(o.total) >= 10; }')).not.toBe(base);
    expect(printOf('function f(o) { return g(o.total) > 11; }')).not.toBe(base);
    expect(printOf('function f(o) { return g(o.sum) > 10; }')).not.toBe(base);
    expect(printOf('function f(o) { return h(o.total) > 10; }')).not.toBe(base);
  });

  it('should treat a nested unit as one opaque token', () => {
    const a = printOf('function f(xs) { return xs.map((x) => x + 1); }');
    const b = printOf('function f(xs) { return xs.map((y) => y * 2 + 7); }');
    expect(a).toBe(b);
  });
});
