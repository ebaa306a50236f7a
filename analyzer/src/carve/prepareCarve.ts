/**
 * Carve index
 * ===========
 * Everything about a snapshot that does not depend on the plan, computed once per snapshot and
 * level so that evaluating an edited plan is one linear pass over modules, module edges and
 * call pairs: per-module sums over their functions (P, ΣV, Σ decisions, S0) and lines; the
 * level's module edges as arrays and as an adjacency list (both directions, for suggested
 * moves); and the call edges merged per distinct (caller, callee) pair with the modules of both
 * ends. Functions that no module of the level claims are kept in one extra slot (index
 * `moduleIds.length`) that always falls in the unassigned service, so sums over services still
 * add up to the codebase. Calls naming a function that is not in the snapshot are left out.
 */
import type { ModuleEdge, ModuleLevel, Snapshot } from '../model';
import { CarveInputError } from './CarveInputError';
import { moduleMembership } from './moduleMembership';

/** Per-snapshot, per-level arrays a plan is evaluated against (see the file header). */
export interface CarveIndex {
  level: ModuleLevel;
  /** The level's module ids; slot `moduleIds.length` of the per-module arrays holds functions of no module. */
  moduleIds: string[];
  modulePaths: string[];
  moduleIndex: Map<string, number>;
  functions: Float64Array;
  cyclomatic: Float64Array;
  decisions: Float64Array;
  design: Float64Array;
  lines: Float64Array;
  /** The level's module edges whose ends are both modules of the level. */
  edgeFrom: Int32Array;
  edgeTo: Int32Array;
  edgeWeight: Float64Array;
  /** Adjacency in CSR form: the neighbours of module m are adjModule[adjStart[m] .. adjStart[m + 1]). */
  adjStart: Int32Array;
  adjModule: Int32Array;
  adjWeight: Float64Array;
  /** Number of functions in the snapshot (the call pairs index them). */
  functionCount: number;
  /** Call edges merged per distinct (caller, callee) pair, self-calls left out. */
  pairFrom: Int32Array;
  pairTo: Int32Array;
  pairFromModule: Int32Array;
  pairToModule: Int32Array;
  /** Call sites of the pair and how many CallEdge entries (kinds, certainty) it merges. */
  pairCalls: Float64Array;
  pairEntries: Int32Array;
}

/** Builds the plan-independent index of `snapshot` at `level` (see the file header). */
export function prepareCarve(snapshot: Snapshot, level: ModuleLevel): CarveIndex {
  const records = (snapshot.modules ?? []).filter((m) => m.level === level);
  const moduleIds = records.map((m) => m.id);
  const moduleIndex = new Map<string, number>();
  moduleIds.forEach((id, i) => moduleIndex.set(id, i));
  if (moduleIndex.size !== moduleIds.length) throw new CarveInputError(`two ${level} modules share an id`);
  const slots = moduleIds.length + 1;
  const detached = moduleIds.length;
  const sums = { functions: new Float64Array(slots), cyclomatic: new Float64Array(slots), decisions: new Float64Array(slots), design: new Float64Array(slots), lines: new Float64Array(slots) };
  records.forEach((m, i) => (sums.lines[i] = m.lines));

  const moduleOfFile = moduleMembership(records, level);
  const functionIndex = new Map<string, number>();
  const functionModule = new Int32Array(snapshot.functions.length);
  snapshot.functions.forEach((fn, f) => {
    functionIndex.set(fn.id, f);
    const id = moduleOfFile(fn.file);
    const m = id === undefined ? detached : moduleIndex.get(id)!;
    functionModule[f] = m;
    sums.functions[m] += 1;
    sums.cyclomatic[m] += fn.cyclomatic;
    sums.decisions[m] += fn.decisions;
    // Without the call graph every function is a leaf, whose iv(G) is 1 (NIST SP 500-235 §7.4).
    sums.design[m] += fn.designComplexity ?? 1;
    if (m === detached) sums.lines[m] += fn.loc;
  });

  return {
    level,
    moduleIds,
    modulePaths: records.map((m) => m.path),
    moduleIndex,
    ...sums,
    ...moduleEdgeArrays(snapshot.moduleEdges ?? [], level, moduleIndex),
    functionCount: snapshot.functions.length,
    ...callPairs(snapshot, functionIndex, functionModule),
  };
}

type EdgeArrays = Pick<CarveIndex, 'edgeFrom' | 'edgeTo' | 'edgeWeight' | 'adjStart' | 'adjModule' | 'adjWeight'>;

function moduleEdgeArrays(all: readonly ModuleEdge[], level: ModuleLevel, moduleIndex: ReadonlyMap<string, number>): EdgeArrays {
  const edges = all.filter((e) => e.level === level && moduleIndex.has(e.from) && moduleIndex.has(e.to));
  const n = edges.length;
  const edgeFrom = new Int32Array(n);
  const edgeTo = new Int32Array(n);
  const edgeWeight = new Float64Array(n);
  const degree = new Int32Array(moduleIndex.size + 1);
  edges.forEach((e, k) => {
    if (!Number.isFinite(e.weight) || e.weight < 0) throw new CarveInputError(`module edge ${e.from} → ${e.to} has weight ${e.weight}; weights must be finite and ≥ 0`);
    edgeFrom[k] = moduleIndex.get(e.from)!;
    edgeTo[k] = moduleIndex.get(e.to)!;
    edgeWeight[k] = e.weight;
    degree[edgeFrom[k]]++;
    if (edgeTo[k] !== edgeFrom[k]) degree[edgeTo[k]]++;
  });
  const adjStart = new Int32Array(moduleIndex.size + 2);
  for (let m = 0; m <= moduleIndex.size; m++) adjStart[m + 1] = adjStart[m] + degree[m];
  const fill = adjStart.slice(0, -1);
  const adjModule = new Int32Array(adjStart[moduleIndex.size + 1]);
  const adjWeight = new Float64Array(adjModule.length);
  for (let k = 0; k < n; k++) {
    const a = edgeFrom[k];
    const b = edgeTo[k];
    adjModule[fill[a]] = b;
    adjWeight[fill[a]++] = edgeWeight[k];
    if (a === b) continue;
    adjModule[fill[b]] = a;
    adjWeight[fill[b]++] = edgeWeight[k];
  }
  return { edgeFrom, edgeTo, edgeWeight, adjStart, adjModule, adjWeight };
}

type PairArrays = Pick<CarveIndex, 'pairFrom' | 'pairTo' | 'pairFromModule' | 'pairToModule' | 'pairCalls' | 'pairEntries'>;

function callPairs(snapshot: Snapshot, functionIndex: ReadonlyMap<string, number>, functionModule: Int32Array): PairArrays {
  const count = snapshot.functions.length;
  // NOTE: a numeric key from·count + to stays exact below 2^53 and hashes faster than a string.
  const slotOf = new Map<number, number>();
  const from: number[] = [];
  const to: number[] = [];
  const calls: number[] = [];
  const entries: number[] = [];
  for (const call of snapshot.calls ?? []) {
    const a = functionIndex.get(call.from);
    const b = functionIndex.get(call.to);
    if (a === undefined || b === undefined || a === b) continue;
    const key = a * count + b;
    let slot = slotOf.get(key);
    if (slot === undefined) {
      slot = from.length;
      slotOf.set(key, slot);
      from.push(a);
      to.push(b);
      calls.push(0);
      entries.push(0);
    }
    calls[slot] += call.count;
    entries[slot] += 1;
  }
  const pairFrom = Int32Array.from(from);
  const pairTo = Int32Array.from(to);
  return {
    pairFrom,
    pairTo,
    pairFromModule: pairFrom.map((f) => functionModule[f]),
    pairToModule: pairTo.map((f) => functionModule[f]),
    pairCalls: Float64Array.from(calls),
    pairEntries: Int32Array.from(entries),
  };
}
