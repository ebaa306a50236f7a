import { DEFAULT_SETTINGS, ESLINT_COMPARABLE_SETTINGS } from '../model/CountingSettings';
import { unitOf } from './fixtures/analyzeSnippet';
import { outcomeOf, predecessorsOf, successorsOf } from './fixtures/describeGraph';
import { validateFlowGraph } from './validateFlowGraph';

const S = DEFAULT_SETTINGS;

/** The graph of the first function in `code`, checked for soundness first. */
function graphOf(code: string, settings = S) {
  const unit = unitOf(code, settings);
  expect(validateFlowGraph(unit.graph)).toEqual([]);
  expect(unit.strict).toBe(unit.count.total + 1);
  return unit.graph;
}

describe('buildFlowGraph shapes', () => {
  describe('short-circuit conditions', () => {
    const code = 'function f() { if (a && b || c) T(); else F(); }';
    it.each([
      ['and', 'a && b', 'true', 'or: a && b || c'],
      ['and', 'a && b', 'false', 'if: a && b || c'],
      ['or', 'a && b || c', 'true', 'T();'],
      ['or', 'a && b || c', 'false', 'if: a && b || c'],
      ['if', 'a && b || c', 'true', 'T();'],
      ['if', 'a && b || c', 'false', 'F();'],
    ])('should send the %s decision "%s" on %s to %s', (kind, text, outcome, target) => {
      expect(outcomeOf(graphOf(code), code, text, outcome as 'true', kind)).toBe(target);
    });

    it('should keep the if decision true = then-branch under a negated compound condition', () => {
      const src = 'function f() { if (!(a && b)) T(); else F(); }';
      const g = graphOf(src);
      expect(outcomeOf(g, src, 'a && b', 'false', 'and')).toBe('T();');
      expect(outcomeOf(g, src, '!(a && b)', 'true', 'if')).toBe('T();');
      expect(outcomeOf(g, src, '!(a && b)', 'false', 'if')).toBe('F();');
    });

    it('should build operators outside conditions: `const x = a && b` evaluates b in its own block', () => {
      const src = 'function f() { const x = a && b; }';
      const g = graphOf(src);
      expect(outcomeOf(g, src, 'a && b', 'true')).toBe('b');
      expect(outcomeOf(g, src, 'a && b', 'false')).toBe('const x = a && b;');
      expect(successorsOf(g, src, 'b')).toEqual(['const x = a && b;']);
    });

    it('should run the right operand of ?? and ||= only on their outcome', () => {
      const src = 'function f() { x = a ?? b; o.p ||= c; }';
      const g = graphOf(src);
      expect(outcomeOf(g, src, 'a ?? b', 'true')).toBe('b');
      expect(outcomeOf(g, src, 'o.p ||= c', 'false')).toBe('c');
      expect(outcomeOf(g, src, 'o.p ||= c', 'true')).toBe('o.p ||= c;');
    });

    it('should short-circuit every ?. of a chain to the end of the whole chain', () => {
      const src = 'function f() { g(a?.b.c?.d(x)); }';
      const g = graphOf(src, ESLINT_COMPARABLE_SETTINGS);
      expect(g.decisions.map((d) => d.text)).toEqual(['a?.b', 'a?.b.c?.d']);
      expect(outcomeOf(g, src, 'a?.b', 'true')).toBe('g(a?.b.c?.d(x));');
      expect(outcomeOf(g, src, 'a?.b.c?.d', 'true')).toBe('g(a?.b.c?.d(x));');
      expect(outcomeOf(g, src, 'a?.b.c?.d', 'false')).toBe('a?.b.c?.d(x)');
    });

    it('should model ?. only when the setting is on', () => {
      expect(graphOf('function f() { return a?.b; }').decisions).toHaveLength(0);
    });
  });

  describe('loops', () => {
    it('should keep the false edge of a constant loop and the decision of a missing test', () => {
      const src = 'function f() { while (true) {} for (;;) {} }';
      const g = graphOf(src);
      expect(g.decisions.map((d) => [d.kind, d.text])).toEqual([['while', 'true'], ['for', 'for (;;)']]);
      expect(outcomeOf(g, src, 'true', 'false')).toBe('for: for (;;)');
      expect(outcomeOf(g, src, 'for (;;)', 'false')).toBe('exit');
    });

    it('should send continue to the update of a for loop and break past the loop', () => {
      const src = 'function f() { for (let i = 0; i < n; i++) { if (a) continue; if (b) break; w(); } done(); }';
      const g = graphOf(src);
      expect(successorsOf(g, src, 'continue;')).toEqual(['i++']);
      expect(successorsOf(g, src, 'break;')).toEqual(['done();']);
      expect(successorsOf(g, src, 'i++')).toEqual(['for: i < n']);
    });

    it('should send continue in a do-while to the test after the body', () => {
      const src = 'function f() { do { if (a) continue; w(); } while (c); }';
      const g = graphOf(src);
      expect(successorsOf(g, src, 'continue;')).toEqual(['do-while: c']);
      expect(outcomeOf(g, src, 'c', 'true')).toBe('join');
    });

    it('should follow labels: continue outer goes to the outer head, break L leaves a labelled block', () => {
      const src = 'function f() { outer: for (const x of xs) { for (const y of ys) { if (y) continue outer; } } L: { if (a) break L; b(); } c(); }';
      const g = graphOf(src);
      expect(successorsOf(g, src, 'continue outer;')).toEqual(['for-of: for (const x of xs)']);
      expect(successorsOf(g, src, 'break L;')).toEqual(['c();']);
    });
  });

  describe('switch', () => {
    it('should test cases in source order, fall through, and reach default wherever it is', () => {
      const src = 'function f() { switch (x) { case 1: a(); case 2: b(); break; default: d(); case 3: e(); } z(); }';
      const g = graphOf(src);
      expect(g.decisions.map((d) => [d.text, d.switchIndex])).toEqual([['case 1', 0], ['case 2', 0], ['case 3', 0]]);
      expect(outcomeOf(g, src, 'case 2', 'false')).toBe('case: case 3');
      expect(outcomeOf(g, src, 'case 3', 'false')).toBe('d();');
      expect(successorsOf(g, src, 'a();')).toEqual(['b(); break;']);
      expect(successorsOf(g, src, 'd();')).toEqual(['e();']);
      expect(predecessorsOf(g, src, 'z();').sort()).toEqual(['b(); break;', 'e();']);
    });

    it('should leave the switch when no case matches and there is no default', () => {
      const src = 'function f() { switch (x) { case 1: a(); } z(); }';
      expect(outcomeOf(graphOf(src), src, 'case 1', 'false')).toBe('z();');
    });
  });

  describe('try, catch and finally', () => {
    it('should put the catch decision at the start of the try and send throws to the catch body', () => {
      const src = 'function f() { try { if (a) throw e; w(); } catch (err) { h(); } z(); }';
      const g = graphOf(src);
      expect(g.blocks[g.edges.find((e) => e.from === g.entry)!.to].kind).toBe('decision');
      expect(outcomeOf(g, src, 'catch (err)', 'true')).toBe('h();');
      expect(outcomeOf(g, src, 'catch (err)', 'false')).toBe('if: a');
      expect(successorsOf(g, src, 'throw e;')).toEqual(['h();']);
    });

    it('should route a return through finally to the exit when the try cannot complete normally', () => {
      const src = 'function f() { try { return 1; } finally { c(); } }';
      const g = graphOf(src);
      expect(successorsOf(g, src, 'return 1;')).toEqual(['c();']);
      expect(successorsOf(g, src, 'c();')).toEqual(['exit']);
    });

    it('should route nested finally blocks in order, each built once', () => {
      const src = 'function f() { try { try { return 1; } finally { a(); } } finally { b(); } }';
      const g = graphOf(src);
      expect(successorsOf(g, src, 'return 1;')).toEqual(['a();']);
      expect(successorsOf(g, src, 'a();')).toEqual(['b();']);
      expect(successorsOf(g, src, 'b();')).toEqual(['exit']);
    });

    it('should send the normal completion through finally and let a jump elsewhere skip it', () => {
      const src = 'function f() { while (c) { try { if (x) break; w(); } finally { fin(); } } z(); }';
      const g = graphOf(src);
      expect(successorsOf(g, src, 'w();')).toEqual(['fin();']);
      expect(successorsOf(g, src, 'fin();')).toEqual(['while: c']);
      expect(successorsOf(g, src, 'break;')).toEqual(['z();']);
    });

    it('should send an uncaught throw through finally to the exit, and a try with finally only adds nothing', () => {
      const src = 'function f() { try { throw e; } finally { c(); } }';
      const g = graphOf(src);
      expect(g.decisions).toHaveLength(0);
      expect(successorsOf(g, src, 'throw e;')).toEqual(['c();']);
      expect(successorsOf(g, src, 'c();')).toEqual(['exit']);
    });
  });

  describe('dead code and spans', () => {
    it('should keep dead code after return with its own block flowing on to the exit', () => {
      const src = 'function f() { return 1; foo(); }';
      const g = graphOf(src);
      expect(predecessorsOf(g, src, 'foo();')).toEqual([]);
      expect(successorsOf(g, src, 'foo();')).toEqual(['exit']);
    });

    it('should give decisions 1-based spans and collapsed, bounded text', () => {
      const long = Array.from({ length: 40 }, (_, i) => `v${i}`).join(' + ');
      const g = graphOf(`function f() {\n  if (a &&\n      b) x();\n  if (${long}) y();\n}`);
      expect(g.decisions[0]).toMatchObject({ kind: 'and', text: 'a && b', span: { line: 2, column: 7, endLine: 2, endColumn: 8 } });
      expect(g.decisions[1]).toMatchObject({ kind: 'if', text: 'a && b', span: { line: 2, column: 7, endLine: 3, endColumn: 8 } });
      expect(g.decisions[2].text).toHaveLength(120);
      expect(g.decisions[2].text.endsWith('…')).toBe(true);
    });

    it('should number switches in source order, outer before inner', () => {
      const g = graphOf('function f() { switch (a) { case 1: switch (b) { case 2: x(); } } switch (c) { case 3: y(); } }');
      expect(g.decisions.map((d) => [d.text, d.switchIndex])).toEqual([['case 1', 0], ['case 2', 1], ['case 3', 2]]);
    });
  });
});
