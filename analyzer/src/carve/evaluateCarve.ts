/**
 * Evaluating a plan against a carve index
 * =======================================
 * The cheap half of carve-plan evaluation (see evaluateCarvePlan.ts for the figures and
 * docs/metrics/carve.md for their definitions): maps each module to a service, then makes one
 * pass over modules (sums), one over module edges (cut weight, cohesion), one over call pairs
 * (cut edges and calls, chatter, the cross-service call graph's S1) and one over the adjacency
 * (suggested moves). Q is summed from the edge pass (see partitionModularity below).
 * Plan entries naming modules the index does not hold are ignored (a plan may outlive a rescan).
 */
import { CarveInputError } from './CarveInputError';
import { crossServiceIntegration } from './crossServiceIntegration';
import { UNASSIGNED_SERVICE, type CarveEvaluation, type CarvePlan, type ServiceFigures } from './CarvePlan';
import type { CarveIndex } from './prepareCarve';
import { suggestMoves } from './suggestMoves';

/** Evaluates `plan` on a prepared index (see the file header). */
export function evaluateCarve(index: CarveIndex, plan: CarvePlan): CarveEvaluation {
  if (plan.level !== index.level) throw new CarveInputError(`the plan is for ${plan.level} modules but the index holds ${index.level} modules`);
  const { serviceOf, services, unassigned, unassignedService } = partition(index, plan);
  const count = services.length;
  const figures: ServiceFigures[] = services.map((service) => ({ service, modules: 0, functions: 0, cyclomatic: 0, decisions: 0, lines: 0, designComplexity: 0, cohesion: 1, chatter: 0, callsOut: 0, callsIn: 0 }));

  for (let m = 0; m < serviceOf.length; m++) {
    const f = figures[serviceOf[m]];
    if (f === undefined) continue; // the empty slot for functions of no module
    if (m < index.moduleIds.length) f.modules++;
    f.functions += index.functions[m];
    f.cyclomatic += index.cyclomatic[m];
    f.decisions += index.decisions[m];
    f.lines += index.lines[m];
    f.designComplexity += index.design[m];
  }

  const inside = new Float64Array(count);
  const outside = new Float64Array(count);
  // Σ degrees per service, for Q; a self-loop adds 2w to its module's degree, as in modularity().
  const degree = new Float64Array(count);
  let cutWeight = 0;
  let totalWeight = 0;
  for (let k = 0; k < index.edgeFrom.length; k++) {
    const a = serviceOf[index.edgeFrom[k]];
    const b = serviceOf[index.edgeTo[k]];
    const w = index.edgeWeight[k];
    totalWeight += w;
    degree[a] += w;
    degree[b] += w;
    if (a === b) {
      inside[a] += w;
    } else {
      outside[a] += w;
      outside[b] += w;
      cutWeight += w;
    }
  }

  let cutEdges = 0;
  let cutCalls = 0;
  for (let k = 0; k < index.pairFrom.length; k++) {
    const a = serviceOf[index.pairFromModule[k]];
    const b = serviceOf[index.pairToModule[k]];
    if (a === b) continue;
    cutEdges += index.pairEntries[k];
    cutCalls += index.pairCalls[k];
    figures[a].callsOut += index.pairCalls[k];
    figures[b].callsIn += index.pairCalls[k];
  }

  let insideWeight = 0;
  let functions = 0;
  figures.forEach((f, s) => {
    f.cohesion = ratio(inside[s], inside[s] + outside[s], 1);
    f.chatter = ratio(f.callsOut, f.functions, 0);
    insideWeight += inside[s];
    functions += f.functions;
  });

  return {
    services: figures,
    cut: { edges: cutEdges, weight: cutWeight, calls: cutCalls },
    chatter: ratio(cutCalls, functions, 0),
    cohesion: ratio(insideWeight, insideWeight + cutWeight, 1),
    integrationComplexity: crossServiceIntegration(index, serviceOf).integrationComplexity,
    modularity: partitionModularity(inside, degree, totalWeight),
    suggestedMoves: suggestMoves(index, serviceOf, services, unassignedService),
    unassigned,
  };
}

// Q = Σ_s [L_s / m − (d_s / 2m)²] from the sums of the edge pass: the same formula and conventions as
// clusters/modularity.ts, without its per-edge map lookups (this runs on every edit of a plan).
function partitionModularity(inside: Float64Array, degree: Float64Array, m: number): number {
  if (m === 0) return 0;
  let q = 0;
  for (let s = 0; s < inside.length; s++) q += inside[s] / m - (degree[s] / (2 * m)) ** 2;
  return q;
}

// 0/0 has no share: a service with no edges keeps all of its (no) weight, one with no functions has no chatter.
function ratio(part: number, whole: number, empty: number): number {
  return whole === 0 ? empty : part / whole;
}

interface Partition {
  /** A service index per module slot (the last slot: functions of no module; -1 when there are none). */
  serviceOf: Int32Array;
  /** Service names in evaluation order: sorted, the unassigned service last. */
  services: string[];
  unassigned: string[];
  /** Index of the unassigned service, -1 when there is none. */
  unassignedService: number;
}

function partition(index: CarveIndex, plan: CarvePlan): Partition {
  const modules = index.moduleIds.length;
  const names: string[] = [];
  const unassigned: string[] = [];
  for (let m = 0; m < modules; m++) {
    const id = index.moduleIds[m];
    const name: unknown = Object.hasOwn(plan.assignment, id) ? plan.assignment[id] : undefined;
    if (name === undefined) unassigned.push(id);
    else if (typeof name !== 'string') throw new CarveInputError(`the plan assigns ${id} to ${JSON.stringify(name)}; service names are text`);
    names.push(name === undefined ? UNASSIGNED_SERVICE : name);
  }
  const detached = index.functions[modules] > 0;
  const services = [...new Set(detached ? [...names, UNASSIGNED_SERVICE] : names)].sort((a, b) => order(a) - order(b) || (a < b ? -1 : a > b ? 1 : 0));
  const position = new Map(services.map((s, i) => [s, i]));
  const serviceOf = new Int32Array(modules + 1);
  names.forEach((name, m) => (serviceOf[m] = position.get(name)!));
  serviceOf[modules] = detached ? position.get(UNASSIGNED_SERVICE)! : -1;
  return { serviceOf, services, unassigned, unassignedService: position.get(UNASSIGNED_SERVICE) ?? -1 };
}

const order = (service: string) => (service === UNASSIGNED_SERVICE ? 1 : 0);
