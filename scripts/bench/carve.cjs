// Carve-plan evaluation on a generated 5,000-module map (issue 4: "under 100 ms for a 5,000-module
// map"): ~50,000 module edges and ~100,000 call edges, seeded so every run measures the same map.
// Times prepareCarve once, a first (cold) evaluateCarve, then evaluateCarve (the per-edit step) as
// the median of 20 edits, each moving one module to another service. Needs the compiled
// analyzer: npx tsc -p tsconfig.analyzer.json.
// Prints JSON lines; the last one is the summary (`ms` = median evaluate time).
const path = require('node:path');
const seedrandom = require('seedrandom');

const root = path.resolve(__dirname, '../..');
const { prepareCarve, evaluateCarve } = require(path.join(root, 'dist/analyzer/analyzer/src/carve/evaluateCarvePlan.js'));

const MODULES = Number(process.env.CARVE_MODULES ?? 5000);
const FUNCTIONS_PER_MODULE = 10;
const MODULE_EDGES = MODULES * 10;
const CALL_EDGES = MODULES * 20;
const SERVICES = 12;
const EDITS = 20;

function generate(rng) {
  const int = (n) => Math.floor(rng() * n);
  const file = (m) => `src/area${m % 50}/m${m}.ts`;
  const modules = [];
  const functions = [];
  for (let m = 0; m < MODULES; m++) {
    modules.push({ id: `file:${file(m)}`, path: file(m), level: 'file', lines: 100 + int(400) });
    for (let k = 0; k < FUNCTIONS_PER_MODULE; k++) {
      const decisions = int(8);
      functions.push({ id: `f${m}_${k}`, file: file(m), cyclomatic: decisions + 1, decisions, designComplexity: 1 + int(decisions + 1), loc: 5 + int(40) });
    }
  }
  // Module edges mostly inside a module's area (so the map has structure), some across.
  const moduleEdges = [];
  for (let e = 0; e < MODULE_EDGES; e++) {
    const from = int(MODULES);
    const to = rng() < 0.7 ? (Math.floor(from / 50) * 50 + int(50)) % MODULES : int(MODULES);
    if (to === from) continue;
    const calls = 1 + int(5);
    const imports = int(2);
    moduleEdges.push({ level: 'file', from: `file:${file(from)}`, to: `file:${file(to)}`, weight: calls + imports, calls, imports });
  }
  const calls = [];
  for (let c = 0; c < CALL_EDGES; c++) {
    calls.push({ from: functions[int(functions.length)].id, to: functions[int(functions.length)].id, count: 1 + int(3), kind: rng() < 0.9 ? 'call' : 'reference', certain: true });
  }
  return { settings: { switch: 'cases', optionalChaining: false, defaultValues: false, limit: 10 }, functions, modules, moduleEdges, calls };
}

const median = (xs) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const now = () => Number(process.hrtime.bigint()) / 1e6;

const rng = seedrandom('seamline-carve-bench');
const snapshot = generate(rng);
const assignment = Object.fromEntries(snapshot.modules.map((m, i) => [m.id, `service-${Math.floor(i / 50) % SERVICES}`]));

let started = now();
const index = prepareCarve(snapshot, 'file');
const prepareMs = now() - started;

// The first evaluation also compiles the code (JIT); it is reported apart from the edits' median.
started = now();
let evaluation = evaluateCarve(index, { level: 'file', assignment });
const coldEvaluateMs = now() - started;
const times = [];
for (let edit = 0; edit < EDITS; edit++) {
  const moved = snapshot.modules[Math.floor(rng() * snapshot.modules.length)].id;
  assignment[moved] = `service-${Math.floor(rng() * SERVICES)}`;
  started = now();
  evaluation = evaluateCarve(index, { level: 'file', assignment });
  times.push(now() - started);
}
const ms = median(times);
console.log(JSON.stringify({ step: 'map', modules: snapshot.modules.length, moduleEdges: snapshot.moduleEdges.length, callEdges: snapshot.calls.length, functions: snapshot.functions.length, services: evaluation.services.length }));
console.log(JSON.stringify({ step: 'figures', cut: evaluation.cut, modularity: evaluation.modularity, integrationComplexity: evaluation.integrationComplexity, suggestedMoves: evaluation.suggestedMoves.length }));
console.log(JSON.stringify({ step: 'summary', prepareMs, coldEvaluateMs, ms, evaluateMinMs: Math.min(...times), evaluateMaxMs: Math.max(...times), edits: EDITS, under100ms: ms < 100, maxRssKb: process.resourceUsage().maxRSS }));
