// Synthetic `seamline/snapshot@1` documents for the server benchmarks: a monorepo of packages,
// each with folders of files, each file with functions. Seeded, so one size always gives the same
// snapshot. Shapes follow what `seamline scan` writes: each function has a small compact graph
// whose V(G) = E − N + 2 = decisions + 1 (mostly V ≤ 5, a tail up to 56); calls stay mostly
// inside their folder, some cross to a package's shared folder and to a few core packages (so a
// handful of god-module candidates stand out); module edges, fan-in/out, Ca/Ce at file, folder
// and package level are summed from those calls and imports. Clusters are planted (neighbouring
// folders, groups of packages) rather than found by Louvain: storing and reading them costs the
// same, and the generator stays fast and independent of the analyzer build.
// Usage: require('./synthetic-snapshot.cjs').generateSnapshot(SIZES.store)
'use strict';
const crypto = require('node:crypto');
const seedrandom = require('seedrandom');

/** Sizes the benchmarks use; modules = packages × (1 + foldersPerPackage × (1 + filesPerFolder)). */
const SIZES = {
  // Issue target: 200,000 functions and 20,000 modules (200 packages, 1,800 folders, 18,000 files).
  store: { packages: 200, foldersPerPackage: 9, filesPerFolder: 10, functions: 200_000 },
  // The same shape at a tenth: the in-run baseline of the store benchmark.
  storeTenth: { packages: 20, foldersPerPackage: 9, filesPerFolder: 10, functions: 20_000 },
  // Read load: 5,000 folder modules (the module graph asked for) and 50,000 functions.
  apiLoad: { packages: 50, foldersPerPackage: 100, filesPerFolder: 2, functions: 50_000 },
};

const VERBS = ['apply', 'build', 'check', 'collect', 'compute', 'dispatch', 'find', 'format', 'handle', 'load', 'merge', 'parse', 'plan', 'price', 'record', 'resolve', 'route', 'save', 'schedule', 'validate'];
const NOUNS = ['Order', 'Invoice', 'Route', 'Parcel', 'Courier', 'Slot', 'Claim', 'Refund', 'Depot', 'Tariff', 'Manifest', 'Customer', 'Shift', 'Label', 'Zone', 'Report'];
const CLASSES = ['OrderService', 'RoutePlanner', 'BillingDesk', 'DepotStore', 'ClaimHandler', 'TariffTable', 'ShiftRoster', 'LabelPrinter'];
const KINDS = [['function', 40], ['method', 35], ['arrow', 18], ['constructor', 3], ['getter', 3], ['setter', 1]];
const DECISIONS = [
  ['if', 42, 'order.status === \'cancelled\''], ['and', 8, 'parcel.weight > limit && !courier.van'], ['or', 6, 'slot.closed || slot.full'],
  ['conditional', 9, 'customer.vip ? discount : 0'], ['for-of', 9, 'for (const item of manifest.items)'], ['for', 3, 'for (let i = 0; i < stops.length; i++)'],
  ['while', 2, 'while (queue.length > 0)'], ['case', 15, 'case \'express\':'], ['catch', 3, 'catch (err)'], ['nullish', 3, 'zone.tariff ?? defaultTariff'],
];
const LOOPS = new Set(['for-of', 'for', 'while']);

/** A picker over weighted choices ([value, weight, …]). */
function weighted(choices) {
  const total = choices.reduce((sum, c) => sum + c[1], 0);
  return (rng) => {
    let x = rng() * total;
    for (const c of choices) if ((x -= c[1]) < 0) return c;
    return choices[choices.length - 1];
  };
}
const pickKind = weighted(KINDS);
const pickDecision = weighted(DECISIONS);

const hash = (text, length, encoding) => crypto.createHash('sha1').update(text).digest(encoding).slice(0, length);

/** Decisions of one function: most have 0–4, about 3 % have 10–54 (busy, tangled, knotted). */
function decisionCount(rng) {
  if (rng() < 0.03) return 10 + Math.floor(rng() ** 4 * 45);
  return Math.min(9, Math.floor(-Math.log(1 - rng()) * 1.6));
}

/**
 * A structured graph with k decisions: entry → start → (decision → body → next)* → end → exit.
 * Loops send their body back to their head. N = 2k + 4 and E = 3k + 3, so E − N + 2 = k + 1.
 */
function compactGraph(rng, line, k) {
  const end = 2 + 2 * k;
  const blocks = [null, [line + 1, 3, line + 1, 30]];
  const edges = [[0, 1], [1, k > 0 ? 2 : end]];
  const decisions = [];
  let row = line + 2;
  for (let i = 0; i < k; i++) {
    const [kind, , text] = pickDecision(rng);
    const head = 2 + 2 * i;
    const next = i < k - 1 ? head + 2 : end;
    blocks.push([row, 5, row, 5 + text.length], [row + 1, 7, row + 1, 48]);
    edges.push([head, head + 1, i, 1], [head, next, i, 0], LOOPS.has(kind) ? [head + 1, head] : [head + 1, next]);
    const decision = { kind, block: head, span: { line: row, column: 5, endLine: row, endColumn: 5 + text.length }, text };
    if (kind === 'case') decision.switchIndex = 0;
    decisions.push(decision);
    row += 2;
  }
  blocks.push([row, 3, row, 18], null);
  edges.push([end, end + 1]);
  return { graph: { entry: 0, exit: end + 1, blocks, edges, decisions }, lastRow: row };
}

/** Splits `total` into `parts` counts in proportion to random weights, the counts adding up exactly. */
function apportion(rng, total, parts) {
  const weights = Array.from({ length: parts }, () => 0.25 - Math.log(1 - rng()));
  const sum = weights.reduce((a, b) => a + b, 0);
  const counts = new Array(parts);
  let cumulative = 0;
  let given = 0;
  for (let i = 0; i < parts; i++) {
    cumulative += weights[i];
    const upTo = Math.round((total * cumulative) / sum);
    counts[i] = upTo - given;
    given = upTo;
  }
  return counts;
}

/**
 * A deterministic synthetic snapshot. Options: packages, foldersPerPackage, filesPerFolder,
 * functions (total), callsPerFunction (mean, default 1.5), seed.
 */
function generateSnapshot({ packages, foldersPerPackage, filesPerFolder, functions: functionCount, callsPerFunction = 1.5, seed = 'seamline-server-bench' }) {
  const rng = seedrandom(`${seed}:${packages}:${foldersPerPackage}:${filesPerFolder}:${functionCount}`);
  const int = (n) => Math.floor(rng() * n);

  // Files in package → folder order, so each folder's and package's functions are one index range.
  const files = [];
  for (let p = 0; p < packages; p++) {
    for (let d = 0; d < foldersPerPackage; d++) {
      for (let f = 0; f < filesPerFolder; f++) {
        files.push({ path: `packages/p${p}/src/area${d}/${NOUNS[(d + f) % NOUNS.length].toLowerCase()}${f}.ts`, pkg: p, folder: p * foldersPerPackage + d, first: 0, count: 0, lines: 0 });
      }
    }
  }
  const perFile = apportion(rng, functionCount, files.length);
  const functions = [];
  const fileOf = new Int32Array(functionCount);
  for (let fi = 0; fi < files.length; fi++) {
    const file = files[fi];
    file.first = functions.length;
    file.count = perFile[fi];
    let line = 1 + int(12);
    const className = CLASSES[int(CLASSES.length)];
    for (let j = 0; j < file.count; j++) {
      const k = decisionCount(rng);
      const kind = pickKind(rng)[0];
      const name = kind === 'constructor' ? 'constructor' : `${VERBS[int(VERBS.length)]}${NOUNS[int(NOUNS.length)]}${j}`;
      const member = kind === 'method' || kind === 'constructor' || kind === 'getter' || kind === 'setter';
      const { graph, lastRow } = compactGraph(rng, line, k);
      const endLine = lastRow + 1 + int(3);
      const v = k + 1;
      fileOf[functions.length] = fi;
      functions.push({
        id: hash(`${file.path}#${name}#${j}`, 16, 'base64url'),
        name,
        qualifiedName: member ? `${className}.${name}` : name,
        kind,
        file: file.path,
        line,
        endLine,
        loc: endLine - line + 1 - int(2),
        cyclomatic: v,
        cyclomaticStrict: v,
        decisions: k,
        nodes: 2 * k + 4,
        edges: 3 * k + 3,
        essential: k > 3 && rng() < 0.3 ? Math.max(1, Math.min(v, 2 + int(Math.ceil(k / 2)))) : 1,
        fingerprint: hash(`fp:${file.path}:${j}:${k}`, 16, 'hex'),
        unresolvedCalls: rng() < 0.05 ? 1 + int(2) : 0,
        externalCalls: int(4),
        designComplexity: 1 + int(v),
        graph,
      });
      line = endLine + 2 + int(4);
    }
    file.lines = line;
  }

  // Calls: mostly inside the folder; else to the package's shared folder (area0) or another
  // folder of the package; a tenth leave the package, half of those to a few core packages.
  const core = Math.max(1, Math.round(packages * 0.03));
  const folderRange = (folder) => {
    const firstFile = folder * filesPerFolder;
    const last = files[firstFile + filesPerFolder - 1];
    return [files[firstFile].first, last.first + last.count];
  };
  const pick = ([from, to]) => (to > from ? from + int(to - from) : -1);
  const calls = new Map();
  for (let i = 0; i < functions.length; i++) {
    const file = files[fileOf[i]];
    const sites = int(2 * callsPerFunction + 1);
    for (let s = 0; s < sites; s++) {
      const r = rng();
      let folder = file.folder;
      if (r >= 0.7 && r < 0.9) folder = file.pkg * foldersPerPackage + (rng() < 0.4 ? 0 : int(foldersPerPackage));
      else if (r >= 0.9) folder = (rng() < 0.5 ? int(core) : int(packages)) * foldersPerPackage + int(foldersPerPackage);
      const to = pick(folderRange(folder));
      if (to < 0 || to === i) continue;
      const u = rng();
      const kind = u < 0.85 ? 'call' : u < 0.9 ? 'new' : 'reference';
      const certain = rng() < 0.95;
      const key = `${i}|${to}|${kind}|${certain}`;
      const edge = calls.get(key);
      if (edge) edge.count++;
      else calls.set(key, { from: functions[i].id, to: functions[to].id, count: 1, kind, certain, fromIndex: i, toIndex: to });
    }
  }

  // File pairs: call sites between files, and one import per pair (plus some type-only imports).
  const pairs = new Map();
  const pair = (a, b) => {
    const key = a * files.length + b;
    let p = pairs.get(key);
    if (!p) pairs.set(key, (p = { a, b, calls: 0, imports: 0 }));
    return p;
  };
  for (const e of calls.values()) {
    const a = fileOf[e.fromIndex];
    const b = fileOf[e.toIndex];
    if (a !== b) pair(a, b).calls += e.count;
  }
  for (const p of pairs.values()) p.imports = 1;
  for (let fi = 0; fi < files.length; fi++) {
    if (rng() < 0.3) {
      const other = files[fi].pkg * foldersPerPackage * filesPerFolder + int(foldersPerPackage * filesPerFolder);
      if (other !== fi) pair(fi, other).imports = 1;
    }
  }
  const imports = [];
  for (const p of pairs.values()) if (p.imports) imports.push({ from: files[p.a].path, to: files[p.b].path });

  const levels = {
    file: { of: (fi) => fi, id: (fi) => `file:${files[fi].path}`, count: files.length },
    folder: { of: (fi) => files[fi].folder, id: (d) => `folder:packages/p${Math.floor(d / foldersPerPackage)}/src/area${d % foldersPerPackage}`, count: packages * foldersPerPackage },
    package: { of: (fi) => files[fi].pkg, id: (p) => `package:packages/p${p}`, count: packages },
  };
  const modules = [];
  const moduleEdges = [];
  const clusters = [];
  for (const [level, { of, id, count }] of Object.entries(levels)) {
    const built = buildLevel(rng, level, count, of, id, { files, functions, pairs, fileOf, calls, foldersPerPackage });
    for (const r of built.modules) modules.push(r);
    for (const e of built.edges) moduleEdges.push(e);
    for (const c of built.clusters) clusters.push(c);
  }

  const totals = { files: files.length, functions: functions.length, cyclomatic: 0, cyclomaticStrict: 0, decisions: 0, overLimit: 0, loc: 0, modularity: 0.61, designComplexity: 0 };
  for (const f of functions) {
    totals.cyclomatic += f.cyclomatic;
    totals.cyclomaticStrict += f.cyclomaticStrict;
    totals.decisions += f.decisions;
    totals.overLimit += f.cyclomatic > 10 ? 1 : 0;
    totals.loc += f.loc;
    totals.designComplexity += f.designComplexity;
  }
  totals.integrationComplexity = totals.designComplexity - functions.length + 1;
  const externalCalls = functions.reduce((sum, f) => sum + f.externalCalls, 0);
  return {
    schema: 'seamline/snapshot@1',
    generator: { name: 'seamline', version: '0.1.0' },
    createdAt: '2026-01-01T00:00:00.000Z',
    root: 'synthetic-monorepo',
    settings: { switch: 'cases', optionalChaining: false, defaultValues: false, limit: 10 },
    files: { scanned: files.length, skipped: [] },
    functions,
    totals,
    mapSettings: { folderDepth: 2, resolution: 1, seed: 'seamline' },
    calls: [...calls.values()].map(({ from, to, count, kind, certain }) => ({ from, to, count, kind, certain })),
    imports,
    externals: [{ package: 'typescript-lib', calls: Math.round(externalCalls * 0.7) }, { package: 'date-fns', calls: externalCalls - Math.round(externalCalls * 0.7) }],
    modules,
    moduleEdges,
    clusters,
  };
}

/** Modules, module edges and planted clusters of one level, summed from files, functions and calls. */
function buildLevel(rng, level, count, of, id, { files, functions, pairs, fileOf, calls, foldersPerPackage }) {
  const m = Array.from({ length: count }, (_, i) => ({
    id: id(i), path: id(i).slice(level.length + 1), level, functions: 0, cyclomatic: 0, decisions: 0, nodes: 0, edges: 0, maxCyclomatic: 0, overLimit: 0,
    lines: 0, fanIn: 0, fanOut: 0, ca: 0, ce: 0, instability: null, abstractness: null, designComplexity: 0, integrationComplexity: 0,
    unresolvedCalls: 0, externalCalls: 0, cluster: null, gravity: 0, gravityRank: 0, reasons: [],
  }));
  if (level === 'package') for (const r of m) r.name = `@bench/${r.path.split('/').pop()}`;
  for (let fi = 0; fi < files.length; fi++) m[of(fi)].lines += files[fi].lines;
  for (let i = 0; i < functions.length; i++) {
    const f = functions[i];
    const r = m[of(fileOf[i])];
    r.functions++;
    r.cyclomatic += f.cyclomatic;
    r.decisions += f.decisions;
    r.nodes += f.nodes;
    r.edges += f.edges;
    r.maxCyclomatic = Math.max(r.maxCyclomatic, f.cyclomatic);
    r.overLimit += f.cyclomatic > 10 ? 1 : 0;
    r.designComplexity += f.designComplexity;
    r.unresolvedCalls += f.unresolvedCalls;
    r.externalCalls += f.externalCalls;
  }
  for (const e of calls.values()) {
    const a = of(fileOf[e.fromIndex]);
    const b = of(fileOf[e.toIndex]);
    if (a !== b) {
      m[a].fanOut += e.count;
      m[b].fanIn += e.count;
    }
  }
  const merged = new Map();
  for (const p of pairs.values()) {
    const a = of(p.a);
    const b = of(p.b);
    if (a === b) continue;
    const key = a * count + b;
    let e = merged.get(key);
    if (!e) merged.set(key, (e = { level, from: m[a].id, to: m[b].id, weight: 0, calls: 0, imports: 0, a, b }));
    e.calls += p.calls;
    e.imports += p.imports;
    e.weight += p.calls + p.imports;
  }
  for (const e of merged.values()) {
    m[e.a].ce++;
    m[e.b].ca++;
  }
  for (const r of m) {
    r.instability = r.ca + r.ce === 0 ? null : r.ce / (r.ca + r.ce);
    r.abstractness = rng() < 0.6 ? null : Math.round(rng() * 4) / 4;
    r.integrationComplexity = r.functions === 0 ? 0 : r.designComplexity - r.functions + 1;
  }
  gravity(m);

  // Planted clusters: two neighbouring folders' files, up to ten folders of one package, or eight packages.
  const groupOf = level === 'file' ? (i) => Math.floor(files[i].folder / 2)
    : level === 'folder' ? (i) => Math.floor(i / foldersPerPackage) * 1000 + Math.floor((i % foldersPerPackage) / 10)
      : (i) => Math.floor(i / 8);
  const groups = new Map();
  m.forEach((r, i) => {
    const g = groupOf(i);
    if (!groups.has(g)) groups.set(g, []);
    groups.get(g).push(i);
  });
  const planted = [...groups.values()].map((members) => ({
    members,
    cyclomatic: members.reduce((sum, i) => sum + m[i].cyclomatic, 0),
  })).sort((x, y) => y.cyclomatic - x.cyclomatic || x.members[0] - y.members[0]);
  const clusterOf = new Int32Array(count);
  const clusters = planted.map((c, index) => {
    const cid = `c${index + 1}`;
    for (const i of c.members) {
      m[i].cluster = cid;
      clusterOf[i] = index;
    }
    return {
      id: cid, level, members: c.members.map((i) => m[i].id), functions: c.members.reduce((sum, i) => sum + m[i].functions, 0),
      cyclomatic: c.cyclomatic, decisions: c.members.reduce((sum, i) => sum + m[i].decisions, 0), internalWeight: 0, externalWeight: 0,
    };
  });
  for (const e of merged.values()) {
    if (clusterOf[e.a] === clusterOf[e.b]) clusters[clusterOf[e.a]].internalWeight += e.weight;
    else {
      clusters[clusterOf[e.a]].externalWeight += e.weight;
      clusters[clusterOf[e.b]].externalWeight += e.weight;
    }
  }
  const edges = [...merged.values()].map(({ a, b, ...edge }) => edge);
  return { modules: m, edges, clusters };
}

/** A god-module score in the snapshot's range (0–100) from ΣV, Ca and fan-in, ranked per level. */
function gravity(modules) {
  const max = (key) => modules.reduce((most, r) => Math.max(most, r[key]), 1);
  const maxV = max('cyclomatic');
  const maxCa = max('ca');
  const maxIn = max('fanIn');
  const sortedV = modules.map((r) => r.cyclomatic).sort((a, b) => a - b);
  const medianV = Math.max(1, sortedV[sortedV.length >> 1]);
  for (const r of modules) {
    r.gravity = Math.round(1000 * (0.4 * (r.cyclomatic / maxV) + 0.3 * (r.ca / maxCa) + 0.3 * (r.fanIn / maxIn))) / 10;
    if (r.cyclomatic >= 2 * medianV) r.reasons.push(`ΣV ${r.cyclomatic}, ${(r.cyclomatic / medianV).toFixed(1)}× the median module`);
    if (r.ca >= maxCa / 2) r.reasons.push(`${r.ca} modules depend on it`);
  }
  [...modules].sort((a, b) => b.gravity - a.gravity || (a.id < b.id ? -1 : 1)).forEach((r, i) => {
    r.gravityRank = i + 1;
  });
}

/** Modules one size gives: packages, folders and files. */
function moduleCount({ packages, foldersPerPackage, filesPerFolder }) {
  return packages * (1 + foldersPerPackage * (1 + filesPerFolder));
}

module.exports = { generateSnapshot, moduleCount, SIZES };
