/**
 * Hand-built flow graphs for tests
 * ================================
 * Two ways to make a `FlowGraph` without parsing source:
 * - `flowGraph('0>1; 1?2:3@while; 2>1; 3>4')` reads a tiny edge language: `a>b` is a plain
 *   edge, `a?t:f` a decision at block a with its true edge to t and false edge to f, and an
 *   optional `@kind` names the decision kind (default `if`). Entry is block 0 unless
 *   `entry=` is given, exit the highest block id unless `exit=` is given. Decisions are numbered
 *   in the order they are written; decision i sits on line i + 1 with text `c<i>`. Every code
 *   block gets a span (line 100 + id), so it reads as a statement rather than an empty join.
 * - `constructGraph(tree)` lays out a tree of structured constructs (sequence, if, if-else,
 *   while, do-while, switch without fall-through, `a && b` / `a || b` conditions) the way a
 *   compiler front end would, so property tests can generate structured programs
 *   (`constructArbitrary`) and, by moving some decision edges (`rewire`), unstructured ones.
 * Test support only: nothing in the analyzer imports this file.
 */
import fc from 'fast-check';
import type { BasicBlock, Decision, DecisionKind, FlowEdge, FlowGraph, Outcome } from '../model';

/** Parses the edge language described above. */
export function flowGraph(spec: string, options: { entry?: number; exit?: number } = {}): FlowGraph {
  const edges: FlowEdge[] = [];
  const decisions: Decision[] = [];
  let maxId = 0;
  for (const raw of spec.split(/[;\n]/)) {
    const item = raw.trim();
    if (item === '') continue;
    const plain = /^(\d+)\s*>\s*(\d+)$/.exec(item);
    const branch = /^(\d+)\s*\?\s*(\d+)\s*:\s*(\d+)\s*(?:@([a-z-]+))?$/.exec(item);
    if (plain) {
      const [from, to] = [Number(plain[1]), Number(plain[2])];
      edges.push({ from, to });
      maxId = Math.max(maxId, from, to);
    } else if (branch) {
      const [block, t, f] = [Number(branch[1]), Number(branch[2]), Number(branch[3])];
      const id = decisions.length;
      const line = id + 1;
      decisions.push({
        id,
        kind: (branch[4] ?? 'if') as DecisionKind,
        block,
        span: { line, column: 1, endLine: line, endColumn: 10 },
        text: `c${id}`,
      });
      edges.push({ from: block, to: t, decision: id, outcome: 'true' }, { from: block, to: f, decision: id, outcome: 'false' });
      maxId = Math.max(maxId, block, t, f);
    } else {
      throw new SyntaxError(`analyzer/testing: cannot read graph item "${item}"`);
    }
  }
  const entry = options.entry ?? 0;
  const exit = options.exit ?? maxId;
  const decisionBlocks = new Set(decisions.map((d) => d.block));
  const blocks: BasicBlock[] = [];
  for (let id = 0; id <= maxId; id++) {
    const kind = id === entry ? 'entry' : id === exit ? 'exit' : decisionBlocks.has(id) ? 'decision' : 'code';
    // Every code block holds a statement here (an empty join has no span).
    const span = kind === 'code' ? { line: 100 + id, column: 1, endLine: 100 + id, endColumn: 10 } : undefined;
    blocks.push(span ? { id, kind, span } : { id, kind });
  }
  return { blocks, edges, decisions, entry, exit };
}

/** A structured program, as a tree. */
export type Construct =
  | { t: 'stmt' }
  | { t: 'seq'; items: Construct[] }
  | { t: 'if'; then: Construct }
  | { t: 'ifElse'; then: Construct; else: Construct }
  | { t: 'while'; body: Construct }
  | { t: 'doWhile'; body: Construct }
  | { t: 'switch'; cases: Construct[]; default?: Construct }
  /** `if (a && b) then` (op 'and') or `if (a || b) then else` (op 'or'). */
  | { t: 'compound'; op: 'and' | 'or'; then: Construct; else?: Construct };

/** Lays out a construct tree as a flow graph: entry → program → exit. */
export function constructGraph(root: Construct): FlowGraph {
  const blocks: BasicBlock[] = [{ id: 0, kind: 'entry' }];
  const edges: FlowEdge[] = [];
  const decisions: Decision[] = [];
  const block = (kind: 'code' | 'decision' = 'code'): number => {
    blocks.push({ id: blocks.length, kind });
    return blocks.length - 1;
  };
  const jump = (from: number, to: number): void => void edges.push({ from, to });
  const decide = (kind: DecisionKind, at: number, t: number, f: number): void => {
    const id = decisions.length;
    const line = id + 1;
    decisions.push({ id, kind, block: at, span: { line, column: 1, endLine: line, endColumn: 10 }, text: `c${id}` });
    const out = (to: number, outcome: Outcome): FlowEdge => ({ from: at, to, decision: id, outcome });
    edges.push(out(t, 'true'), out(f, 'false'));
  };
  // Returns the block where control continues after `c`, given the block it starts from.
  const lay = (c: Construct, cur: number): number => {
    switch (c.t) {
      case 'stmt': {
        const next = block();
        blocks[next].span = { line: 100 + next, column: 1, endLine: 100 + next, endColumn: 10 };
        jump(cur, next);
        return next;
      }
      case 'seq':
        return c.items.reduce((at, item) => lay(item, at), cur);
      case 'if':
      case 'ifElse': {
        const d = block('decision');
        jump(cur, d);
        const [t, j] = [block(), block()];
        const f = c.t === 'ifElse' ? block() : j;
        decide('if', d, t, f);
        jump(lay(c.then, t), j);
        if (c.t === 'ifElse') jump(lay(c.else, f), j);
        return j;
      }
      case 'while': {
        const head = block('decision');
        jump(cur, head);
        const [body, after] = [block(), block()];
        decide('while', head, body, after);
        jump(lay(c.body, body), head);
        return after;
      }
      case 'doWhile': {
        const body = block();
        jump(cur, body);
        const test = block('decision');
        jump(lay(c.body, body), test);
        const after = block();
        decide('do-while', test, body, after);
        return after;
      }
      case 'switch': {
        const j = block();
        let test = block('decision');
        jump(cur, test);
        c.cases.forEach((body, i) => {
          const start = block();
          const last = i === c.cases.length - 1;
          const next = last ? block() : block('decision');
          decide('case', test, start, next);
          jump(lay(body, start), j);
          test = next;
        });
        jump(c.default ? lay(c.default, test) : test, j);
        return j;
      }
      case 'compound': {
        const [a, b] = [block('decision'), block('decision')];
        jump(cur, a);
        const [t, j] = [block(), block()];
        const f = c.else ? block() : j;
        if (c.op === 'and') decide('and', a, b, f);
        else decide('or', a, t, b);
        decide('if', b, t, f);
        jump(lay(c.then, t), j);
        if (c.else) jump(lay(c.else, f), j);
        return j;
      }
    }
  };
  const last = lay(root, 0);
  const exit = block();
  blocks[exit].kind = 'exit';
  jump(last, exit);
  return { blocks, edges, decisions, entry: 0, exit };
}

/** E − N + 2 over the blocks reachable from the entry (the V(G) a test can actually exercise). */
export function reachableCyclomatic(graph: FlowGraph): number {
  const seen = reachableBlocks(graph);
  const n = seen.filter(Boolean).length;
  const e = graph.edges.filter((edge) => seen[edge.from]).length;
  return e - n + 2;
}

/** Which blocks the entry reaches. */
export function reachableBlocks(graph: FlowGraph): boolean[] {
  const seen = graph.blocks.map(() => false);
  const stack = [graph.entry];
  seen[graph.entry] = true;
  while (stack.length > 0) {
    const b = stack.pop()!;
    for (const e of graph.edges) {
      if (e.from === b && !seen[e.to]) {
        seen[e.to] = true;
        stack.push(e.to);
      }
    }
  }
  return seen;
}

/** Random structured programs, nested at most `maxDepth` deep. */
export function constructArbitrary(maxDepth = 4): fc.Arbitrary<Construct> {
  const { tree } = fc.letrec<{ tree: Construct }>((tie) => {
    const sub = tie('tree');
    return {
      tree: fc.oneof(
        { maxDepth, depthIdentifier: 'construct' },
        fc.constant<Construct>({ t: 'stmt' }),
        fc.array(sub, { minLength: 1, maxLength: 3 }).map((items): Construct => ({ t: 'seq', items })),
        sub.map((then): Construct => ({ t: 'if', then })),
        fc.tuple(sub, sub).map(([then, otherwise]): Construct => ({ t: 'ifElse', then, else: otherwise })),
        sub.map((body): Construct => ({ t: 'while', body })),
        sub.map((body): Construct => ({ t: 'doWhile', body })),
        fc.tuple(fc.array(sub, { minLength: 1, maxLength: 3 }), fc.option(sub, { nil: undefined }))
          .map(([cases, fallback]): Construct => (fallback ? { t: 'switch', cases, default: fallback } : { t: 'switch', cases })),
        fc.tuple(fc.constantFrom<'and' | 'or'>('and', 'or'), sub, fc.option(sub, { nil: undefined }))
          .map(([op, then, otherwise]): Construct => (otherwise ? { t: 'compound', op, then, else: otherwise } : { t: 'compound', op, then })),
      ),
    };
  });
  return tree;
}

/**
 * Moves decision edges to other blocks (never to the entry): `moves[k] = [edge, target]`
 * picks the edge among the decision edges and the target among the blocks, both modulo their
 * counts. The result may hold dead code and blocks that never reach the exit.
 */
export function rewire(graph: FlowGraph, moves: readonly [number, number][]): FlowGraph {
  const edges = graph.edges.map((e) => ({ ...e }));
  const branching = edges.filter((e) => e.decision !== undefined);
  const targets = graph.blocks.filter((b) => b.id !== graph.entry);
  if (branching.length === 0) return { ...graph, edges };
  for (const [edge, target] of moves) branching[edge % branching.length].to = targets[target % targets.length].id;
  return { ...graph, edges };
}
