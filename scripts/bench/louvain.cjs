// Clustering and gravity on a generated 100,000-module graph (average degree 10, weighted edges).
// Baseline: plain graphology Louvain on the same undirected graph, built beforehand. Also timed:
// building that graphology graph from the merged pairs (a floor any graphology-based clustering of
// a snapshot pays). Ours: what mapCodebase runs per level from ModuleRecords and ModuleEdges —
// indexModuleLevel, clusterLevel, rankLevelGravity (merging the edges and building the graph included).
// Needs the compiled analyzer: `npx tsc -p tsconfig.analyzer.json` (dist/analyzer/analyzer/src/…).
// Usage: node scripts/bench/louvain.cjs [modules=100000] [rounds=3]
// Prints one JSON line per measurement, then a summary line with the medians and their ratio.
const path = require('node:path');
const { UndirectedGraph } = require('graphology');
const louvain = require('graphology-communities-louvain');
const seedrandom = require('seedrandom');

const dist = process.env.SEAMLINE_ANALYZER_DIST ?? path.resolve(__dirname, '../../dist/analyzer/analyzer/src');
const { clusterLevel, indexModuleLevel } = require(path.join(dist, 'clusters/clusterModules.js'));
const { rankLevelGravity } = require(path.join(dist, 'gravity/rankGravity.js'));

const N = Number(process.argv[2] ?? 100_000);
const ROUNDS = Number(process.argv[3] ?? 3);
const DEGREE = 10;
const SEED = 'seamline-bench';

/**
 * Planted partition of our own: groups of 50–150 modules; each module sends DEGREE/2 edges
 * (so the undirected average degree is DEGREE), 80 % inside its group, the rest anywhere;
 * weights 1–8 (call sites plus imports), heavier inside. Repeated pairs are merged, as a
 * snapshot's module edges are.
 */
function generate(n, rng) {
  const group = new Int32Array(n);
  const groupStart = [];
  for (let i = 0, g = 0; i < n; g++) {
    const size = 50 + Math.floor(rng() * 101);
    groupStart.push(i);
    for (let j = 0; j < size && i < n; j++, i++) group[i] = g;
  }
  groupStart.push(n);
  const modules = [];
  for (let i = 0; i < n; i++) {
    const v = 1 + Math.floor(-Math.log(1 - rng()) * 20);
    const p = `src/g${group[i]}/m${i}.ts`;
    modules.push({
      id: `file:${p}`, path: p, level: 'file', functions: 1 + Math.floor(v / 3), cyclomatic: v, decisions: v - 1, nodes: 0, edges: 0,
      maxCyclomatic: v, overLimit: 0, lines: 10 * v, fanIn: 0, fanOut: 0, ca: 0, ce: 0, instability: null, abstractness: null,
      designComplexity: 0, integrationComplexity: 0, unresolvedCalls: 0, externalCalls: 0, cluster: null, gravity: 0, gravityRank: 0, reasons: [],
    });
  }
  modules.sort((a, b) => (a.id < b.id ? -1 : 1));
  const index = new Map(modules.map((m, i) => [m.id, i]));
  const byGroupPos = (i) => index.get(`file:src/g${group[i]}/m${i}.ts`);
  const weights = new Map();
  for (let i = 0; i < n; i++) {
    const g = group[i];
    for (let k = 0; k < DEGREE / 2; k++) {
      const inside = rng() < 0.8;
      const j = inside ? groupStart[g] + Math.floor(rng() * (groupStart[g + 1] - groupStart[g])) : Math.floor(rng() * n);
      if (j === i) continue;
      const a = byGroupPos(i);
      const b = byGroupPos(j);
      const key = a * n + b;
      weights.set(key, (weights.get(key) ?? 0) + 1 + Math.floor(rng() * (inside ? 8 : 3)));
    }
  }
  const edges = [];
  for (const [key, weight] of weights) {
    const a = Math.floor(key / n);
    edges.push({ level: 'file', from: modules[a].id, to: modules[key - a * n].id, weight, calls: weight, imports: 0 });
  }
  return { modules, edges };
}

function median(xs) {
  const s = [...xs].sort((a, b) => a - b);
  return s[s.length >> 1];
}

function time(fn) {
  const started = process.hrtime.bigint();
  const value = fn();
  return { ms: Number(process.hrtime.bigint() - started) / 1e6, value };
}

const { modules, edges } = generate(N, seedrandom(SEED));
const graph = new UndirectedGraph();
for (const m of modules) graph.addNode(m.id);
for (const e of edges) graph.updateEdge(e.from, e.to, (attr) => ({ weight: (attr.weight ?? 0) + e.weight }));
const settings = { folderDepth: 2, resolution: 1, seed: SEED };
const pairs = graph.mapEdges((_key, attr, from, to) => [from, to, attr.weight]);

function buildGraph() {
  const g = new UndirectedGraph();
  for (const m of modules) g.addNode(m.id);
  pairs.forEach(([from, to, weight], k) => g.addEdgeWithKey(String(k), from, to, { weight }));
  return g;
}

const baseline = [];
const builds = [];
const ours = [];
for (let round = 0; round < ROUNDS; round++) {
  const build = time(buildGraph);
  builds.push(build.ms);
  console.log(JSON.stringify({ task: 'graphology-build', round, ms: build.ms, edges: build.value.size }));
  const plain = time(() => louvain.detailed(graph, { rng: seedrandom(SEED), getEdgeWeight: 'weight' }));
  baseline.push(plain.ms);
  console.log(JSON.stringify({ task: 'graphology-louvain', round, ms: plain.ms, communities: plain.value.count, modularity: plain.value.modularity }));
  // As mapCodebase runs each level: one index of the level, then clusters, then gravity.
  const indexed = time(() => indexModuleLevel(modules, edges, 'file'));
  const cluster = time(() => clusterLevel(indexed.value, settings));
  const gravity = time(() => rankLevelGravity(indexed.value, cluster.value.community));
  const total = indexed.ms + cluster.ms + gravity.ms;
  ours.push(total);
  console.log(JSON.stringify({ task: 'index+clusterLevel+rankLevelGravity', round, ms: total, indexMs: indexed.ms, clusterMs: cluster.ms, gravityMs: gravity.ms, clusters: cluster.value.clusters.length, modularity: cluster.value.modularity }));
}
const louvainMs = median(baseline);
const buildMs = median(builds);
const oursMs = median(ours);
console.log(JSON.stringify({
  modules: N, moduleEdges: edges.length, undirectedEdges: graph.size, averageDegree: (2 * graph.size) / N, rounds: ROUNDS,
  louvainMs, buildMs, oursMs, ratio: oursMs / louvainMs, ratioWithBuild: oursMs / (louvainMs + buildMs), targetMs: 3000,
  maxRssKb: process.resourceUsage().maxRSS,
}));
