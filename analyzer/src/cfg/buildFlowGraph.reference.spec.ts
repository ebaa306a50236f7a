import { DEFAULT_SETTINGS, ESLINT_COMPARABLE_SETTINGS, type CountingSettings } from '../model/CountingSettings';
import type { FlowGraph } from '../model/FlowGraph';
import { cyclomaticOf } from '../metrics/cyclomatic';
import { analyzeSnippet, unitOf } from './fixtures/analyzeSnippet';

const CLASSIC = ESLINT_COMPARABLE_SETTINGS;
const MODIFIED: CountingSettings = { ...ESLINT_COMPARABLE_SETTINGS, switch: 'one' };

/** Number of entry→exit paths of an acyclic graph (dynamic programming in topological order). */
function pathCount(graph: FlowGraph): number {
  const out = graph.blocks.map(() => [] as number[]);
  const indegree = graph.blocks.map(() => 0);
  for (const e of graph.edges) {
    out[e.from].push(e.to);
    indegree[e.to]++;
  }
  const paths = graph.blocks.map((b) => (b.id === graph.entry ? 1 : 0));
  const ready = graph.blocks.filter((b) => indegree[b.id] === 0).map((b) => b.id);
  while (ready.length > 0) {
    const b = ready.pop()!;
    for (const to of out[b]) {
      paths[to] += paths[b];
      if (--indegree[to] === 0) ready.push(to);
    }
  }
  return paths[graph.exit];
}

const ifs25 = `function many(a) { let n = 0;\n${Array.from({ length: 25 }, (_, i) => `  if (a[${i}]) n++;`).join('\n')}\n  return n; }`;
const euclid = 'function euclid(m, n) { let r; if (n > m) { r = m; m = n; n = r; } r = m % n; while (r !== 0) { m = n; n = r; r = m % n; } return n; }';

describe('V(G) against published values', () => {
  describe('McCabe 1976 and NIST SP 500-235', () => {
    it.each([
      // [what, code, V(G), source]
      ['sequence', 'function f(a) { const b = a + 1; return b * 2; }', 1, 'McCabe 1976 §1.9: sequence v = 1 (DERIVED)'],
      ['if-then', 'function f(c) { if (c) a(); }', 2, 'McCabe 1976 §1.9: if-then v = 2 (DERIVED)'],
      ['if-then-else', 'function f(c) { if (c) a(); else b(); }', 2, 'McCabe 1976 §1.9: if-then-else v = 2 (DERIVED)'],
      ['while', 'function f(c) { while (c()) a(); }', 2, 'McCabe 1976 §1.9: while v = 2 (DERIVED)'],
      ['repeat-until', 'function f(c) { do a(); while (c()); }', 2, 'McCabe 1976 §1.9: repeat-until v = 2 (DERIVED)'],
      ['4-way case', 'function f(x) { switch (x) { case 1: a(); break; case 2: b(); break; case 3: c(); break; default: d(); } }', 4, 'McCabe 1976 §1.9: k-way case v = k (DERIVED)'],
      ['three ifs', 'function f(a, b, c) { if (a) x(); if (b) y(); if (c) z(); }', 4, 'McCabe 1976 §1.4: v = π + 1, 3 ifs → 4 (from memory; NIST §4.1 VERIFIED-TEXT)'],
      ['compound predicate', 'function f(a, b) { if (a && b) x(); }', 3, 'McCabe 1976 §1.5: IF C1 AND C2 counts 2 predicates (from memory)'],
      ['25 consecutive ifs', ifs25, 26, 'McCabe 1976 §1.8: 25 IF-THEN constructs, v = 26 (DERIVED)'],
      ['euclid', euclid, 3, 'NIST SP 500-235 §2.2/§2.4: euclid v = 3 (DERIVED; ESLint VERIFIED-RUN)'],
      ['switch with 3 cases and default', 'function f(x) { switch (x) { case 1: a(); break; case 2: b(); break; case 3: c(); break; default: d(); } }', 4, 'NIST SP 500-235 §4: each case adds 1, default 0 → 4 (from memory; ESLint VERIFIED-RUN)'],
    ])('should give %s V(G) = %i', (_what, code, expected, _source) => {
      const unit = unitOf(code, DEFAULT_SETTINGS);
      expect(unit.strict).toBe(expected);
      expect(unit.count.total + 1).toBe(expected);
    });

    it('should draw if-then-else and while with the published node and edge counts plus our entry block', () => {
      // McCabe 1976 §1.9 (DERIVED): if-else 4 nodes / 4 edges, while 3 nodes / 3 edges. Our graphs
      // add one empty entry block and its edge; the exit block is the published join/exit node.
      const ifElse = unitOf('function f(c) { if (c) a(); else b(); }', DEFAULT_SETTINGS);
      expect([ifElse.nodes, ifElse.edges]).toEqual([4 + 1, 4 + 1]);
      const loop = unitOf('function f(c) { while (c()) a(); }', DEFAULT_SETTINGS);
      expect([loop.nodes, loop.edges]).toEqual([3 + 1, 3 + 1]);
    });

    it('should count 2^25 paths through 25 consecutive ifs while V(G) stays 26', () => {
      // McCabe 1976 §1.8: "33.5 million" paths (SECONDARY), 2^25 = 33,554,432 (DERIVED).
      const unit = unitOf(ifs25, DEFAULT_SETTINGS);
      expect(pathCount(unit.graph)).toBe(33_554_432);
      expect(unit.strict).toBe(26);
    });

    it('should find the two decisions of euclid: the if and the while (with its back edge)', () => {
      // NIST SP 500-235 §2.2 (VERIFIED-TEXT): decision nodes 1 (if) and 7 (while), back edge 10→7.
      const { graph } = unitOf(euclid, DEFAULT_SETTINGS);
      expect(graph.decisions.map((d) => [d.kind, d.text])).toEqual([['if', 'n > m'], ['while', 'r !== 0']]);
      const loopHead = graph.decisions[1].block;
      const backEdges = graph.edges.filter((e) => e.to === loopHead && e.from > loopHead);
      expect(backEdges).toHaveLength(1);
    });

    it('should add up over components: v(M ∪ A ∪ B) = v(M) + v(A) + v(B) with p = 3', () => {
      // McCabe 1976 §1.6: three graphs, p = 3, 6 = 2 + 2 + 2 (construction DERIVED; paper figure from memory).
      const units = analyzeSnippet('function M(c) { if (c) A(); else B(); }\nfunction A(d) { if (d) x(); else y(); }\nfunction B(e) { while (e()) z(); }', DEFAULT_SETTINGS);
      const parts = ['M', 'A', 'B'].map((name) => units.get(name)!);
      const union: FlowGraph = { blocks: [], edges: [], decisions: [], entry: 0, exit: 0 };
      for (const { graph } of parts) {
        const offset = union.blocks.length;
        for (const b of graph.blocks) union.blocks.push({ ...b, id: b.id + offset });
        for (const e of graph.edges) union.edges.push({ from: e.from + offset, to: e.to + offset });
      }
      const v = cyclomaticOf(union);
      expect(v.components).toBe(3);
      // Published construction: e = n = 11; ours adds an entry block and edge per graph (+3 / +3).
      expect([v.edges, v.nodes]).toEqual([11 + 3, 11 + 3]);
      expect(v.strict).toBe(6);
      expect(v.strict).toBe(parts.reduce((sum, u) => sum + u.strict, 0));
    });
  });

  describe('textbook flow graphs', () => {
    it('should give the nested IF example 7 nodes, 8 edges and V = 3', () => {
      // Common teaching example (reference-checks §4.4, SECONDARY): 7 nodes, 8 edges, v = 3.
      const unit = unitOf('function f(A, B, C) { if (A === 10) { if (B > C) { A = B; } else { A = C; } } print(A); print(B); print(C); }', DEFAULT_SETTINGS);
      expect([unit.nodes, unit.edges, unit.strict]).toEqual([7, 8, 3]);
    });

    it.each([
      ['D0 if-then', 'if (c) a();', 2],
      ['D1 if-then-else', 'if (c) a(); else b();', 2],
      ['D2 while', 'while (c()) a();', 2],
      ['D3 repeat', 'do a(); while (c());', 2],
      ['C3 case', 'switch (x) { case 1: a(); break; case 2: b(); break; default: c(); }', 3],
      ['sequence of two ifs', 'if (c) a(); if (d) b();', 3],
    ])('should give the Fenton–Bieman prime %s V = %i', (_name, body, expected) => {
      // Fenton & Bieman 2014 (reference-checks §4.3, from memory): D0–D3 v = 2, Cn v = n, F1;F2 = v1 + v2 − 1.
      expect(unitOf(`function f(c, d, x) { ${body} }`, DEFAULT_SETTINGS).strict).toBe(expected);
    });

    it('should follow the nesting rule v(F(F1)) = v(F) + v(F1) − 1', () => {
      // Fenton & Bieman 2014 (reference-checks §4.3, from memory; DERIVED from v = e − n + 2).
      const outer = unitOf('function f(c) { while (c()) { work(); } }', DEFAULT_SETTINGS).strict;
      const inner = unitOf('function f(a, b) { if (a && b) x(); else y(); }', DEFAULT_SETTINGS).strict;
      const nested = unitOf('function f(c, a, b) { while (c()) { if (a && b) x(); else y(); } }', DEFAULT_SETTINGS).strict;
      expect(nested).toBe(outer + inner - 1);
    });
  });

  describe('ESLint 9.39.5 complexity rule (reference-checks §8, VERIFIED-RUN)', () => {
    // Each row: the code, the unit, classic value, modified value. ESLint reports per function;
    // our ESLint-comparable settings count `?.` and default values as ESLint does.
    it.each([
      ['function seq(a){const b=a+1;return b*2}', 'seq', 1, 1],
      ['function f(x){if(x){return 1}return 0}', 'f', 2, 2],
      ['function f(x){if(x){a()}else{b()}}', 'f', 2, 2],
      ['function f(x){if(x===1)a();else if(x===2)b();else c()}', 'f', 3, 3],
      ['function f(c){while(c()){a()}}', 'f', 2, 2],
      ['function f(c){do{a()}while(c())}', 'f', 2, 2],
      ['function f(){for(let i=0;i<3;i++){a()}}', 'f', 2, 2],
      ['function f(xs){for(const x of xs){a(x)}}', 'f', 2, 2],
      ['function f(o){for(const k in o){a(k)}}', 'f', 2, 2],
      ['function f(a,b){if(a&&b){x()}}', 'f', 3, 3],
      ['function f(a,b,c){if(a||b||c){x()}}', 'f', 4, 4],
      ['function f(a){return a??0}', 'f', 2, 2],
      ['function f(a){return a?1:2}', 'f', 2, 2],
      ['function f(o){o.a||=1; o.b&&=2; o.c??=3;}', 'f', 4, 4],
      ['function f(a=1){return a}', 'f', 2, 2],
      ['function f(o){const {x=1,y=2}=o; return x+y}', 'f', 3, 3],
      ['function f(a){return a?.b?.c}', 'f', 3, 3],
      ['function f(f){return f?.()}', 'f', 2, 2],
      ['function f(){try{a()}catch(e){b()}finally{c()}}', 'f', 2, 2],
      ['function f(x){switch(x){case 1:a();break;case 2:b();break;case 3:c();break;default:d()}}', 'f', 4, 2],
      ['function f(x){switch(x){case 1: case 2: a(); break; default: b()}}', 'f', 3, 2],
      [euclid, 'euclid', 3, 3],
      ['function f(a,b){if(a){if(b){x()}}}', 'f', 3, 3],
      ['function f(a,b,c){if(a)return 1;if(b)return 2;if(c)return 3;return 0}', 'f', 4, 4],
      ['function f(xs){for(const x of xs){if(x<0)break}}', 'f', 3, 3],
      ['function f(xs,ys){outer: for(const x of xs){for(const y of ys){if(y)continue outer;a(x,y)}}}', 'f', 4, 4],
      ['function outer(){const inner=x=>x?1:2;return inner(1)}', 'outer', 1, 1],
      ['function outer(){const inner=x=>x?1:2;return inner(1)}', 'arrow@1', 2, 2],
      ['class K{ m(a){return a?1:0} x=a||b; static{ if(c) d(); } }', 'K.m', 2, 2],
      ['class K{ m(a){return a?1:0} x=a||b; static{ if(c) d(); } }', 'K.x', 2, 2],
      ['class K{ m(a){return a?1:0} x=a||b; static{ if(c) d(); } }', 'K.static', 2, 2],
      [ifs25, 'many', 26, 26],
    ])('%s → %s: classic %i, modified %i', (code, name, classic, modified) => {
      const c = unitOf(code, CLASSIC, name);
      expect(c.strict).toBe(classic);
      expect(c.count.total + 1).toBe(classic);
      expect(c.reported).toBe(classic);
      expect(unitOf(code, MODIFIED, name).reported).toBe(modified);
    });

    it('should differ from ESLint only where the counting settings say so', () => {
      // ESLint counts `?.` and default values (§8); McCabe's strict defaults do not (documented difference).
      expect(unitOf('function f(a){return a?.b?.c}', DEFAULT_SETTINGS).strict).toBe(1);
      expect(unitOf('function f(a=1){return a}', DEFAULT_SETTINGS).strict).toBe(1);
      expect(unitOf('function f(o){const {x=1,y=2}=o; return x+y}', DEFAULT_SETTINGS).strict).toBe(1);
    });

    it('should leave top-level code, which ESLint does not report, as its own unit', () => {
      const units = analyzeSnippet('if (a) b();\nfunction f(){ if (c) d(); }', CLASSIC);
      expect(units.get('top-level')!.strict).toBe(2);
      expect(units.get('f')!.strict).toBe(2);
    });
  });
});
