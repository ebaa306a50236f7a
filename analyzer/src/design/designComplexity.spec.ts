import fc from 'fast-check';
import { ts } from 'ts-morph';
import { buildFlowGraph } from '../cfg/buildFlowGraph';
import { collectUnits } from '../cfg/fixtures/collectUnits';
import { programArbitraries } from '../cfg/fixtures/programArbitrary';
import { ProgramRenderer } from '../cfg/fixtures/renderProgram';
import { cyclomaticOf } from '../metrics/cyclomatic';
import { DEFAULT_SETTINGS, type FlowGraph } from '../model';
import { constructArbitrary, constructGraph, flowGraph, reachableCyclomatic, rewire, type Construct } from '../testing/graphs';
import { callBlocksOf } from './callBlocksOf';
import { designComplexity } from './designComplexity';
import { integrationComplexity } from './integrationComplexity';

interface Measured {
  iv: number;
  v: number;
}

/**
 * iv(G) of every function declaration in `text`. Call nodes are the blocks holding calls to the
 * snippet's other declared functions, found with a small walk that stops at nested functions.
 */
function designOf(text: string): Map<string, Measured> {
  const sourceFile = ts.createSourceFile('design.ts', text, ts.ScriptTarget.Latest, true);
  const declared = sourceFile.statements.filter(ts.isFunctionDeclaration);
  const names = new Set(declared.map((f) => f.name!.text));
  const result = new Map<string, Measured>();
  for (const fn of declared) {
    const sites: { line: number; column: number }[] = [];
    const stack: ts.Node[] = [fn.body!];
    while (stack.length > 0) {
      const node = stack.pop()!;
      if (ts.isFunctionLike(node)) continue;
      if (ts.isCallExpression(node) && ts.isIdentifier(node.expression) && names.has(node.expression.text) && node.expression.text !== fn.name!.text) {
        const { line, character } = sourceFile.getLineAndCharacterOfPosition(node.getStart(sourceFile));
        sites.push({ line: line + 1, column: character + 1 });
      }
      ts.forEachChild(node, (child) => void stack.push(child));
    }
    const graph = buildFlowGraph(fn, sourceFile, DEFAULT_SETTINGS);
    result.set(fn.name!.text, { iv: designComplexity(graph, callBlocksOf(graph, sites)), v: cyclomaticOf(graph).strict });
  }
  return result;
}

function totals(measured: Map<string, Measured>): { s0: number; n: number; s1: number } {
  const s0 = [...measured.values()].reduce((sum, m) => sum + m.iv, 0);
  return { s0, n: measured.size, s1: integrationComplexity(s0, measured.size) };
}

describe('designComplexity: the worked checks of reference-checks §2.11', () => {
  it('should give a leaf module iv = 1 whatever its decisions', () => {
    // NIST SP 500-235 §7.4 / McCabe & Butler 1989 (DERIVED, reference-checks 2.11 (i)): a leaf module has iv = 1.
    const m = designOf('function leaf(a, b) { if (a > b) { return a; } for (let i = 0; i < b; i++) { a += i; } return a || b; }');
    expect(m.get('leaf')!.v).toBe(4);
    expect(m.get('leaf')!.iv).toBe(1);
  });

  it('should give a call chain S0 = n and S1 = 1', () => {
    // McCabe & Butler 1989 (DERIVED, reference-checks 2.11 (ii)): n modules in a chain, no call-affecting decisions.
    const m = designOf(`
      function first() { second(); }
      function second(x) { if (x) { x = 0; } third(); }
      function third(y) { while (y > 0) { y--; } fourth(); }
      function fourth() { return 1; }`);
    expect([...m.values()].map((f) => f.iv)).toEqual([1, 1, 1, 1]);
    expect(totals(m)).toEqual({ s0: 4, n: 4, s1: 1 });
  });

  it('should give main with if/else calls iv = 2 and the tree S0 = 5, S1 = 2', () => {
    // McCabe & Butler 1989 (DERIVED, reference-checks 2.11 (iii)): iv = 2, 1, 1, 1; S0 = 5; n = 4; S1 = 2.
    const m = designOf(`
      function main(c) { if (c) A(); else B(); }
      function A() { C(); }
      function B() { return 2; }
      function C() { return 3; }`);
    expect(['main', 'A', 'B', 'C'].map((name) => m.get(name)!.iv)).toEqual([2, 1, 1, 1]);
    expect(totals(m)).toEqual({ s0: 5, n: 4, s1: 2 });
  });
});

describe('designComplexity: the reduction rules (NIST SP 500-235 §7.4)', () => {
  // Each expected value is DERIVED from the rules: only decisions that control a call stay.
  it.each([
    ['a decision whose branches hold no call', 'function f(c) { if (c) { c = 1; } else { c = 2; } g(); }', 1, 2],
    ['a call-free loop before a call', 'function f(n) { while (n > 0) { n--; } g(); }', 1, 2],
    ['a loop whose body calls', 'function f(xs) { for (const x of xs) { g(x); } }', 2, 2],
    ['an if that guards a call', 'function f(c) { if (c) { g(); } }', 2, 2],
    ['both conditions of a compound predicate guarding a call', 'function f(a, b) { if (a && b) { g(); } }', 3, 3],
    ['a call in a condition whose branches hold no call', 'function f(c) { if (g()) { c = 1; } return c; }', 1, 2],
    ['a loop repeating the call in its own test', 'function f() { while (g()) { } }', 2, 2],
    ['a call-free early exit from a loop (unstructured)', 'function f(xs) { for (const x of xs) { if (x) break; x++; } g(); }', 1, 3],
    ['a loop left early whose body calls', 'function f(xs) { for (const x of xs) { if (!x) break; g(x); } }', 3, 3],
    ['a switch with one calling case', 'function f(k) { switch (k) { case 1: g(); break; case 2: k = 0; break; case 3: k = 1; } }', 2, 4],
    ['calls in two separate ifs', 'function f(a, b) { if (a) g(); if (b) h(); }', 3, 3],
    ['a call after a return in dead code', 'function f(a) { if (a) { return 1; } return 2; g(); }', 1, 2],
  ])('should reduce %s', (_what, body, iv, v) => {
    const m = designOf(`${body}\nfunction g() {}\nfunction h() {}`);
    expect(m.get('f')).toEqual({ iv, v });
  });

  it('should handle deep nesting without recursion', () => {
    const depth = 400; // the TypeScript parser itself recurses per nesting level
    const m = designOf(`function f(a) { ${'if (a) {'.repeat(depth)} g(); ${'}'.repeat(depth)} }\nfunction g() {}`);
    expect(m.get('f')).toEqual({ iv: depth + 1, v: depth + 1 });
    const free = designOf(`function f(a) { ${'if (a) {'.repeat(depth)} a++; ${'}'.repeat(depth)} g(); }\nfunction g() {}`);
    expect(free.get('f')).toEqual({ iv: 1, v: depth + 1 });
  });

  it('should refuse a call block that is not in the graph', () => {
    expect(() => designComplexity(flowGraph('0>1; 1?2:3; 2>3'), new Set([9]))).toThrow(/analyzer\/design: call block 9/);
  });
});

/** The kept decisions of a structured program, read off its tree (independent of any graph). */
function keptByTree(root: Construct, isCall: (stmt: number) => boolean): { kept: number; calls: boolean } {
  let stmt = 0;
  const walk = (c: Construct): { kept: number; calls: boolean } => {
    switch (c.t) {
      case 'stmt':
        return { kept: 0, calls: isCall(stmt++) };
      case 'seq': {
        const parts = c.items.map(walk);
        return { kept: parts.reduce((s, p) => s + p.kept, 0), calls: parts.some((p) => p.calls) };
      }
      case 'if':
      case 'while':
      case 'doWhile': {
        const inner = walk(c.t === 'if' ? c.then : c.body);
        return { kept: inner.kept + (inner.calls ? 1 : 0), calls: inner.calls };
      }
      case 'ifElse':
      case 'compound': {
        const parts = [walk(c.then), ...(c.t === 'ifElse' ? [walk(c.else)] : c.else ? [walk(c.else)] : [])];
        const calls = parts.some((p) => p.calls);
        const own = c.t === 'compound' ? 2 : 1;
        return { kept: parts.reduce((s, p) => s + p.kept, 0) + (calls ? own : 0), calls };
      }
      case 'switch': {
        const parts = [...c.cases.map(walk), ...(c.default ? [walk(c.default)] : [])];
        let kept = parts.reduce((s, p) => s + p.kept, 0);
        // Case test i chooses between body i and everything after it (the later tests and bodies).
        for (let i = 0; i < c.cases.length; i++) if (parts.slice(i).some((p) => p.calls)) kept++;
        return { kept, calls: parts.some((p) => p.calls) };
      }
    }
  };
  return walk(root);
}

/** The statement blocks of a constructed graph, in the order the tree lists its statements. */
function statementBlocks(graph: FlowGraph): number[] {
  return graph.blocks.filter((b) => b.span !== undefined).sort((a, b) => a.span!.line - b.span!.line).map((b) => b.id);
}

describe('designComplexity: properties', () => {
  const program = fc.tuple(constructArbitrary(4), fc.array(fc.boolean(), { maxLength: 60 }));

  it('should keep exactly the decisions whose structure holds a call on structured programs', () => {
    fc.assert(
      fc.property(program, ([tree, pick]) => {
        const graph = constructGraph(tree);
        const stmts = statementBlocks(graph);
        const isCall = (k: number): boolean => pick[k] ?? false;
        const calls = new Set(stmts.filter((_, k) => isCall(k)));
        expect(designComplexity(graph, calls)).toBe(1 + keptByTree(tree, isCall).kept);
      }),
      { numRuns: 1500 },
    );
  });

  it('should give iv = V when every statement calls and iv = 1 when none does', () => {
    fc.assert(
      fc.property(constructArbitrary(4), (tree) => {
        const graph = constructGraph(tree);
        expect(designComplexity(graph, new Set(statementBlocks(graph)))).toBe(cyclomaticOf(graph).strict);
        expect(designComplexity(graph, new Set())).toBe(1);
      }),
      { numRuns: 500 },
    );
  });

  it('should stay within 1 ≤ iv ≤ V and never fall when a call is added, on unstructured graphs', () => {
    const moves = fc.array(fc.tuple(fc.nat(), fc.nat()), { maxLength: 4 });
    const property = fc.property(constructArbitrary(3), moves, fc.array(fc.nat(), { maxLength: 6 }), fc.nat(), (tree, move, picks, extra) => {
      unstructuredBounds(tree, move, picks, extra); // a returned value would count as a failure
    });
    fc.assert(property, { numRuns: 1500 });
  });
});

/** The unstructured-graph property; returns iv before and after adding the extra call block. */
function unstructuredBounds(tree: Construct, move: [number, number][], picks: number[], extra: number): { iv: number; more: number } {
  const graph = rewire(constructGraph(tree), move);
  const n = graph.blocks.length;
  const calls = new Set(picks.map((p) => p % n));
  const iv = designComplexity(graph, calls);
  expect(iv).toBeGreaterThanOrEqual(1);
  expect(iv).toBeLessThanOrEqual(Math.max(1, reachableCyclomatic(graph)));
  const more = designComplexity(graph, new Set([...calls, extra % n]));
  expect(more).toBeGreaterThanOrEqual(iv);
  return { iv, more };
}

describe('designComplexity: regressions on loops entered from outside their head', () => {
  // Collapsing such a loop once left stale post-dominators for the rest of the round: the
  // decision above it was then "collapsed" towards the loop head, its region ran past the exit,
  // and the exit was deleted (iv 2 where it is 1). Expected values are DERIVED from the rules
  // (NIST SP 500-235 §7.4): a decision stays only when it chooses whether a call node is reached.
  it('should give iv = 1 when only the entry calls and a decision jumps into a loop body', () => {
    // 0 (calls) → 1: true into the body 3, false to the head 2; loop 2 ⇄ 3; 2 → 4 → exit 5.
    const graph = flowGraph('0>1; 1?3:2; 2?3:4@while; 3>2; 4>5');
    expect(designComplexity(graph, new Set([0]))).toBe(1);
    // The loop's only way out (block 4) is on every path: still no decision chooses it.
    expect(designComplexity(graph, new Set([0, 4]))).toBe(1);
    // A call in the body: the head decides how often it runs and 1 whether it runs at once.
    expect(designComplexity(graph, new Set([0, 3]))).toBe(3);
  });

  // The counterexamples fast-check printed, as [tree, rewiring moves, call picks, extra call].
  it.each<[string, Construct, [number, number][], number[], number, number, number]>([
    [
      'a switch whose last case test jumps into the body of a while (extra call after that loop: case tests 1 and 2 decide it)',
      { t: 'switch', cases: [{ t: 'if', then: { t: 'stmt' } }, { t: 'switch', cases: [{ t: 'while', body: { t: 'stmt' } }] }, { t: 'while', body: { t: 'stmt' } }] },
      [[1588117619, 1537917246]], [0], 1565453471, 1, 3,
    ],
    [
      'an if/else whose test jumps into the body of the while in its else branch (extra call on every path)',
      { t: 'ifElse', then: { t: 'seq', items: [{ t: 'stmt' }, { t: 'stmt' }] }, else: { t: 'while', body: { t: 'stmt' } } },
      [[0, 457823714]], [0], 872705667, 1, 1,
    ],
    [
      'an if whose false edge jumps into the body of the while it guards (extra call at the exit)',
      { t: 'if', then: { t: 'while', body: { t: 'if', then: { t: 'stmt' } } } },
      [[1060309465, 1894864613]], [0], 2098592891, 1, 1,
    ],
  ])('should reduce %s', (_what, tree, move, picks, extra, iv, more) => {
    expect(unstructuredBounds(tree, move, picks, extra)).toEqual({ iv, more });
  });
});

describe('designComplexity on generated TypeScript', () => {
  // Every construct the graph builder models: try/catch/finally, labelled jumps, fall-through, early exits.
  const programArbitrary = fc
    .record({ body: programArbitraries.block })
    .map(({ body }) => `function main(p0) {\n${new ProgramRenderer().functionBody(body).join('\n')}\n}\n`);

  it('should stay within 1 ≤ iv ≤ V, give 1 without calls and never fall when a call node is added', () => {
    // NIST SP 500-235 §7.4 (reference-checks §9.5): 1 ≤ iv ≤ v.
    fc.assert(
      fc.property(programArbitrary, fc.array(fc.nat(), { maxLength: 5 }), fc.nat(), (text, picks, extra) => {
        const { sourceFile, units, syntaxErrors } = collectUnits(text);
        expect(syntaxErrors).toEqual([]);
        const main = units.find((u) => ts.isFunctionDeclaration(u))!;
        const graph = buildFlowGraph(main, sourceFile, DEFAULT_SETTINGS);
        const coded = graph.blocks.filter((b) => b.span !== undefined).map((b) => b.id);
        const v = cyclomaticOf(graph).strict;
        expect(designComplexity(graph, new Set())).toBe(1);
        if (coded.length === 0) return;
        const calls = new Set(picks.map((p) => coded[p % coded.length]));
        const iv = designComplexity(graph, calls);
        expect(iv).toBeGreaterThanOrEqual(1);
        expect(iv).toBeLessThanOrEqual(v);
        expect(designComplexity(graph, new Set([...calls, coded[extra % coded.length]]))).toBeGreaterThanOrEqual(iv);
      }),
      { numRuns: 500 },
    );
  });
});

describe('integrationComplexity', () => {
  it('should be S0 − n + 1', () => {
    // NIST SP 500-235 §7.5 / McCabe & Butler 1989: S1 = S0 − n + 1.
    expect(integrationComplexity(5, 4)).toBe(2);
    expect(integrationComplexity(7, 7)).toBe(1);
  });

  it('should refuse S0 below n (each iv is at least 1)', () => {
    expect(() => integrationComplexity(3, 4)).toThrow(RangeError);
    expect(() => integrationComplexity(2.5, 1)).toThrow(/analyzer\/design/);
  });
});
