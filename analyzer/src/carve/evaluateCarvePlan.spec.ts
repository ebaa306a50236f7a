import { UndirectedGraph } from 'graphology';
import graphModularity from 'graphology-metrics/graph/modularity';
import { modularity } from '../clusters/modularity';
import { CarveInputError } from './CarveInputError';
import { evaluateCarvePlan, prepareCarve, evaluateCarve, UNASSIGNED_SERVICE, type CarvePlan } from './evaluateCarvePlan';
import { fn, mapSnapshot, moduleEdge, ORDERS_AND_BILLING_FILES as F, ordersAndBilling } from './fixtures/moduleMapSnapshot';

const file = (path: string) => `file:${path}`;
const splitByFolder: CarvePlan = {
  level: 'file',
  assignment: { [file(F.A)]: 'orders', [file(F.B)]: 'orders', [file(F.C)]: 'billing', [file(F.D)]: 'billing', [file(F.E)]: 'billing' },
};

// Hand-worked in docs/metrics/carve.md ("Worked example"): five files, orders = {a, b},
// billing = {c, d, e}. Undirected module-edge weights: a–b 4, c–d 4, b–c 2, d–a 1, e–a 3, e–d 1 (m = 15).
describe('evaluateCarvePlan on the orders/billing example', () => {
  const evaluation = evaluateCarvePlan(ordersAndBilling(), splitByFolder);

  it('should sum P, ΣV, Σ decisions, lines and S0 per service', () => {
    // billing: c1 (V 4), d1 (1), d2 (2), e1 (2) → P 4, ΣV 9, Σ decisions 5 = ΣV − P; lines 50 + 30 + 10;
    // S0 = 2 + 1 + 1 + 1. orders: a1 (3), a2 (1), b1 (2) → P 3, ΣV 6, decisions 3; lines 40 + 20; S0 2 + 1 + 1.
    expect(evaluation.services.map(({ service, modules, functions, cyclomatic, decisions, lines, designComplexity }) => ({ service, modules, functions, cyclomatic, decisions, lines, designComplexity }))).toEqual([
      { service: 'billing', modules: 3, functions: 4, cyclomatic: 9, decisions: 5, lines: 90, designComplexity: 5 },
      { service: 'orders', modules: 2, functions: 3, cyclomatic: 6, decisions: 3, lines: 60, designComplexity: 4 },
    ]);
  });

  it('should count the cut in call edges, call sites and module-edge weight', () => {
    // Crossing CallEdge entries: b1→c1, d2→a1, e1→a1 (call) and e1→a1 (reference) = 4, one site each;
    // crossing module edges: b→c 2 + d→a 1 + e→a 3 = 6.
    expect(evaluation.cut).toEqual({ edges: 4, weight: 6, calls: 4 });
  });

  it('should give chatter and cohesion per service and overall', () => {
    const [billing, orders] = evaluation.services;
    // billing: 3 sites out (d2→a1, e1→a1 twice) over 4 functions; 1 in (b1→c1). Inside c–d 4 + e–d 1 = 5 of 5 + 6.
    expect([billing.callsOut, billing.callsIn, billing.chatter, billing.cohesion]).toEqual([3, 1, 3 / 4, 5 / 11]);
    // orders: 1 site out over 3 functions; 3 in. Inside a–b 4 of 4 + 6.
    expect([orders.callsOut, orders.callsIn, orders.chatter, orders.cohesion]).toEqual([1, 3, 1 / 3, 4 / 10]);
    // Overall: 4 cut sites over 7 functions; 9 of the 15 weight inside.
    expect(evaluation.chatter).toBe(4 / 7);
    expect(evaluation.cohesion).toBe(9 / 15);
  });

  it('should give S1 of the cross-service call graph', () => {
    // Distinct crossing pairs (b1,c1), (d2,a1), (e1,a1): e = 3, n = 5, components {b1,c1} and {d2,a1,e1}: p = 2.
    // S1 = e − n + 2p = 3 − 5 + 4 = 2: one integration test per connected group of calls, no cycles.
    expect(evaluation.integrationComplexity).toBe(2);
  });

  it('should give Q of the partition, by hand and as the graph library computes it', () => {
    // Degrees a 8, b 6, c 6, d 6, e 4; orders: inside 4, Σd 14; billing: inside 5, Σd 16.
    // Q = (4/15 − (14/30)²) + (5/15 − (16/30)²) = 9/15 − 452/900 = 88/900 (Newman 2006, PNAS 103(23)).
    expect(evaluation.modularity).toBeCloseTo(88 / 900, 12);
    const graph = new UndirectedGraph();
    const weights: [string, string, number][] = [[F.A, F.B, 4], [F.C, F.D, 4], [F.B, F.C, 2], [F.D, F.A, 1], [F.E, F.A, 3], [F.E, F.D, 1]];
    for (const [a, b, weight] of weights) graph.mergeEdge(a, b, { weight });
    const service = (path: string) => splitByFolder.assignment[file(path)];
    expect(evaluation.modularity).toBeCloseTo(graphModularity(graph, { getNodeCommunity: (node) => service(node) }), 12);
  });

  it('should suggest moving e to orders, where 3 of its 4 weight goes', () => {
    expect(evaluation.suggestedMoves).toEqual([
      { module: file(F.E), from: 'billing', to: 'orders', share: 0.75, reason: '75% of its weight goes to orders (3 of 4); 25% stays in billing' },
    ]);
    expect(evaluation.unassigned).toEqual([]);
  });

  it('should improve the split when the suggestion is taken', () => {
    const moved = evaluateCarvePlan(ordersAndBilling(), { ...splitByFolder, assignment: { ...splitByFolder.assignment, [file(F.E)]: 'orders' } });
    // Cut: b→c 2 + d→a 1 + e→d 1 = 4. Q: orders {a,b,e} inside 7, Σd 18; billing {c,d} inside 4, Σd 12:
    // Q = 11/15 − (18² + 12²)/900 = 192/900. Crossing pairs (b1,c1), (d2,a1), (e1,d1): S1 = 3 − 6 + 2·3 = 3.
    expect(moved.cut).toEqual({ edges: 3, weight: 4, calls: 3 });
    expect(moved.modularity).toBeCloseTo(192 / 900, 12);
    expect(moved.integrationComplexity).toBe(3);
    expect(moved.suggestedMoves).toEqual([]);
  });
});

describe('evaluateCarvePlan at other levels and with gaps', () => {
  it('should place functions in folder modules by their folder', () => {
    const evaluation = evaluateCarvePlan(ordersAndBilling(), { level: 'folder', assignment: { 'folder:src/orders': 'orders', 'folder:src/billing': 'billing' } });
    expect(evaluation.services.map((s) => [s.service, s.functions, s.cyclomatic, s.lines])).toEqual([['billing', 4, 9, 90], ['orders', 3, 6, 60]]);
    // Two folders joined by weight 2 + 4 = 6 and nothing inside: Q = 0 − 2·(6/12)² = −0.5, cohesion 0.
    expect(evaluation.cut).toEqual({ edges: 4, weight: 6, calls: 4 });
    expect(evaluation.modularity).toBeCloseTo(-0.5, 12);
    expect(evaluation.cohesion).toBe(0);
  });

  it('should put modules the plan leaves out into the unassigned service, and suggest them a home', () => {
    const assignment = { ...splitByFolder.assignment };
    delete assignment[file(F.E)];
    const evaluation = evaluateCarvePlan(ordersAndBilling(), { level: 'file', assignment });
    expect(evaluation.unassigned).toEqual([file(F.E)]);
    expect(evaluation.services.map((s) => [s.service, s.modules, s.functions, s.cyclomatic])).toEqual([['billing', 2, 3, 7], ['orders', 2, 3, 6], [UNASSIGNED_SERVICE, 1, 1, 2]]);
    expect(evaluation.suggestedMoves.map((m) => [m.module, m.from, m.to, m.share])).toEqual([[file(F.E), UNASSIGNED_SERVICE, 'orders', 0.75]]);
  });

  it('should count functions no module claims in the unassigned service and ignore plan entries for unknown modules', () => {
    const snapshot = ordersAndBilling();
    const stray = fn('scripts/seed.ts', 'seed', 3);
    const withStray = mapSnapshot([...snapshot.functions, stray], { modules: snapshot.modules, moduleEdges: snapshot.moduleEdges, calls: snapshot.calls });
    const evaluation = evaluateCarvePlan(withStray, { ...splitByFolder, assignment: { ...splitByFolder.assignment, 'file:gone.ts': 'orders' } });
    expect(evaluation.unassigned).toEqual([]);
    expect(evaluation.services.at(-1)).toMatchObject({ service: UNASSIGNED_SERVICE, modules: 0, functions: 1, cyclomatic: 3, decisions: 2, lines: stray.loc });
    expect(evaluation.services.reduce((s, x) => s + x.cyclomatic, 0)).toBe(withStray.totals.cyclomatic);
  });

  it('should give an empty, neutral evaluation for a snapshot without a module map', () => {
    const bare = mapSnapshot([fn('a.ts', 'f', 2)], {});
    const evaluation = evaluateCarvePlan(bare, { level: 'file', assignment: {} });
    expect(evaluation.services).toEqual([expect.objectContaining({ service: UNASSIGNED_SERVICE, functions: 1, cohesion: 1, chatter: 0 })]);
    expect([evaluation.modularity, evaluation.integrationComplexity, evaluation.cohesion, evaluation.chatter]).toEqual([0, 0, 1, 0]);
  });

  it('should count a module edge to itself inside its service, as the shared modularity() does', () => {
    const snapshot = ordersAndBilling();
    snapshot.moduleEdges!.push(moduleEdge('file', F.C, F.C, 2, 0));
    const evaluation = evaluateCarvePlan(snapshot, splitByFolder);
    // Inside billing 5 + 2, Σd 16 + 4 (a self-loop adds 2w to its module's degree), m = 17:
    // Q = 4/17 + 7/17 − (14² + 20²)/34² = 11/17 − 596/1156.
    expect(evaluation.modularity).toBeCloseTo(11 / 17 - 596 / 1156, 12);
    expect(evaluation.modularity).toBeCloseTo(modularity(snapshot.moduleEdges!.filter((e) => e.level === 'file'), (id) => splitByFolder.assignment[id]), 12);
    expect(evaluation.services[0].cohesion).toBe(7 / 13);
  });

  it('should refuse a plan for another level and a service name that is not text', () => {
    const index = prepareCarve(ordersAndBilling(), 'file');
    expect(() => evaluateCarve(index, { level: 'folder', assignment: {} })).toThrow(CarveInputError);
    expect(() => evaluateCarve(index, { level: 'file', assignment: { [file(F.A)]: 7 as unknown as string } })).toThrow(/analyzer\/carve: the plan assigns file:src\/orders\/a\.ts to 7/);
  });
});
