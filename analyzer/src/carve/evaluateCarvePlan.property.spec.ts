import fc from 'fast-check';
import { UndirectedGraph } from 'graphology';
import graphModularity from 'graphology-metrics/graph/modularity';
import { modularity } from '../clusters/modularity';
import type { CallEdge, ModuleEdge, Snapshot } from '../model';
import type { CarvePlan } from './CarvePlan';
import { evaluateCarve, evaluateCarvePlan, prepareCarve } from './evaluateCarvePlan';
import { fn, mapSnapshot, moduleRecord } from './fixtures/moduleMapSnapshot';

const SERVICES = ['x', 'y', 'z'];

interface GeneratedMap {
  snapshot: Snapshot;
  plan: CarvePlan;
}

// A random file-level map: modules m0..mk, functions in them (or in a file no module claims),
// module edges between distinct modules, calls between any functions, a plan that may leave gaps.
const generatedMap: fc.Arbitrary<GeneratedMap> = fc.integer({ min: 1, max: 8 }).chain((modules) =>
  fc
    .record({
      functions: fc.array(fc.record({ module: fc.nat({ max: modules }), v: fc.integer({ min: 1, max: 9 }) }), { maxLength: 16 }),
      edges: fc.array(fc.record({ from: fc.nat({ max: modules - 1 }), to: fc.nat({ max: modules - 1 }), calls: fc.nat({ max: 5 }), imports: fc.nat({ max: 2 }) }), { maxLength: 16 }),
      calls: fc.array(fc.record({ from: fc.nat(), to: fc.nat(), count: fc.integer({ min: 1, max: 4 }), kind: fc.constantFrom<CallEdge['kind']>('call', 'new', 'reference') }), { maxLength: 24 }),
      plan: fc.array(fc.option(fc.constantFrom(...SERVICES), { nil: undefined }), { minLength: modules, maxLength: modules }),
    })
    .map(({ functions, edges, calls, plan }) => {
      const path = (m: number) => (m === modules ? 'tools/loose.ts' : `src/m${m}.ts`);
      const records = functions.map(({ module, v }, i) => fn(path(module), `f${i}`, v));
      const moduleEdges: ModuleEdge[] = edges
        .filter((e) => e.from !== e.to)
        .map((e) => ({ level: 'file', from: `file:${path(e.from)}`, to: `file:${path(e.to)}`, weight: e.calls + e.imports, calls: e.calls, imports: e.imports }));
      const callEdges: CallEdge[] =
        records.length === 0 ? [] : calls.map((c) => ({ from: records[c.from % records.length].id, to: records[c.to % records.length].id, count: c.count, kind: c.kind, certain: true }));
      const snapshot = mapSnapshot(records, { modules: Array.from({ length: modules }, (_, m) => moduleRecord('file', path(m))), moduleEdges, calls: callEdges });
      const assignment: Record<string, string> = {};
      plan.forEach((service, m) => service !== undefined && (assignment[`file:${path(m)}`] = service));
      return { snapshot, plan: { level: 'file' as const, assignment } };
    }),
);

// An independent S1 for the check: flood fill over an adjacency of Sets.
function referenceS1(snapshot: Snapshot, serviceOfFunction: (id: string) => string): number {
  const pairs = new Set<string>();
  const neighbours = new Map<string, Set<string>>();
  const link = (a: string, b: string) => (neighbours.get(a) ?? neighbours.set(a, new Set()).get(a)!).add(b);
  for (const c of snapshot.calls ?? []) {
    if (c.from === c.to || serviceOfFunction(c.from) === serviceOfFunction(c.to)) continue;
    pairs.add(`${c.from}\0${c.to}`);
    link(c.from, c.to);
    link(c.to, c.from);
  }
  const seen = new Set<string>();
  let components = 0;
  for (const start of neighbours.keys()) {
    if (seen.has(start)) continue;
    components++;
    const stack = [start];
    seen.add(start);
    while (stack.length > 0) for (const next of neighbours.get(stack.pop()!)!) if (!seen.has(next) && seen.add(next)) stack.push(next);
  }
  return pairs.size - neighbours.size + 2 * components;
}

const RUNS = { numRuns: 400 };

describe('evaluateCarvePlan properties', () => {
  it('should split ΣV, P and Σ decisions over the services of any plan without loss', () => {
    fc.assert(
      fc.property(generatedMap, ({ snapshot, plan }) => {
        const { services } = evaluateCarvePlan(snapshot, plan);
        const sum = (pick: (s: (typeof services)[number]) => number) => services.reduce((t, s) => t + pick(s), 0);
        expect(sum((s) => s.cyclomatic)).toBe(snapshot.totals.cyclomatic);
        expect(sum((s) => s.functions)).toBe(snapshot.totals.functions);
        expect(sum((s) => s.decisions)).toBe(snapshot.totals.decisions);
        // ΣV = Σ decisions + P per service, as for the codebase (each function a component).
        for (const s of services) expect(s.cyclomatic).toBe(s.decisions + s.functions);
      }),
      RUNS,
    );
  });

  it('should give Q = 0 to the all-in-one plan, with no cut and no integration tests', () => {
    // Newman & Girvan 2004, Phys. Rev. E 69: Q of the one-community partition is 0.
    fc.assert(
      fc.property(generatedMap, ({ snapshot }) => {
        const assignment = Object.fromEntries((snapshot.modules ?? []).map((m) => [m.id, 'one']));
        const evaluation = evaluateCarvePlan(snapshot, { level: 'file', assignment });
        expect(evaluation.modularity).toBeCloseTo(0, 12);
        expect(evaluation.cut.weight).toBe(0);
        expect(evaluation.suggestedMoves).toEqual([]);
      }),
      RUNS,
    );
  });

  it('should give the same evaluation after moving a module and moving it back, on one prepared index', () => {
    fc.assert(
      fc.property(generatedMap, fc.nat(), fc.constantFrom(...SERVICES), ({ snapshot, plan }, pick, target) => {
        const index = prepareCarve(snapshot, 'file');
        const first = evaluateCarve(index, plan);
        const id = index.moduleIds[pick % index.moduleIds.length];
        const moved = { ...plan, assignment: { ...plan.assignment, [id]: target } };
        expect(evaluateCarve(index, moved)).toEqual(evaluateCarvePlan(snapshot, moved));
        expect(evaluateCarve(index, plan)).toEqual(first);
      }),
      RUNS,
    );
  });

  it("should agree with the graph library's modularity and with a flood-fill S1, and keep the balances", () => {
    fc.assert(
      fc.property(generatedMap, ({ snapshot, plan }) => {
        const evaluation = evaluateCarvePlan(snapshot, plan);
        const serviceOfModule = (id: string) => plan.assignment[id] ?? '(unassigned)';
        const graph = new UndirectedGraph();
        for (const e of snapshot.moduleEdges ?? []) if (e.weight > 0) graph.updateEdge(e.from, e.to, (a) => ({ weight: ((a.weight as number | undefined) ?? 0) + e.weight }));
        const expected = graph.size === 0 ? 0 : graphModularity(graph, { getNodeCommunity: (node) => serviceOfModule(node) });
        expect(evaluation.modularity).toBeCloseTo(expected, 10);
        expect(evaluation.modularity).toBeCloseTo(modularity(snapshot.moduleEdges ?? [], serviceOfModule), 10);

        const fileOf = new Map(snapshot.functions.map((f) => [f.id, f.file]));
        const serviceOfFunction = (id: string) => (fileOf.get(id)!.startsWith('src/') ? serviceOfModule(`file:${fileOf.get(id)}`) : '(unassigned)');
        expect(evaluation.integrationComplexity).toBe(referenceS1(snapshot, serviceOfFunction));
        expect(evaluation.integrationComplexity).toBeGreaterThanOrEqual(0);

        const totalWeight = (snapshot.moduleEdges ?? []).reduce((t, e) => t + e.weight, 0);
        expect(evaluation.cohesion * totalWeight).toBeCloseTo(totalWeight - evaluation.cut.weight, 9);
        const out = evaluation.services.reduce((t, s) => t + s.callsOut, 0);
        const into = evaluation.services.reduce((t, s) => t + s.callsIn, 0);
        expect([out, into]).toEqual([evaluation.cut.calls, evaluation.cut.calls]);
        if (snapshot.functions.length > 0) expect(evaluation.chatter).toBeCloseTo(evaluation.cut.calls / snapshot.functions.length, 12);
        for (const move of evaluation.suggestedMoves) expect(move.share).toBeGreaterThan(0);
      }),
      RUNS,
    );
  });
});
