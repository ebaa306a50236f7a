/**
 * Gravity ranking
 * ===============
 * Scores every module of one level as a god-module candidate (gravityScore.ts, documented in
 * docs/metrics/gravity.md), gives each score its reasons (gravityReasons.ts) and ranks the
 * modules 1..n by descending gravity, ties by path, then id. Also returns each module's spread
 * (other clusters its edges touch, in or out) and cohesion (share of its edge weight inside its
 * own cluster). Medians are taken over all of the level's modules. Linear in modules plus edges
 * apart from one sort per median and the final ranking sort.
 *
 * [Reference]: our own score; see docs/metrics/gravity.md.
 */
import { indexLevel, type LevelIndex } from '../clusters/levelIndex';
import type { ModuleEdge, ModuleLevel, ModuleRecord } from '../model';
import { GravityInputError } from './GravityInputError';
import { gravityReasons } from './gravityReasons';
import { gravityComponents, gravityOf, gravityPoints, type GravityFacts, type LevelMedians } from './gravityScore';
import { medianOf } from './medianOf';
import { clusterIndexes, levelTraffic } from './moduleTraffic';

/** One module's gravity, its rank at its level, the reasons, spread and cohesion. */
export interface GravityResult {
  gravity: number;
  rank: number;
  reasons: string[];
  spread: number;
  cohesion: number;
}

/** Gravity of `level`'s modules given their clusters (see the file header). */
export function rankGravity(modules: ModuleRecord[], edges: ModuleEdge[], assignment: Map<string, string>, level: ModuleLevel): Map<string, GravityResult> {
  const indexed = indexLevel(modules, edges, level, (message) => new GravityInputError(message));
  return rankLevelGravity(indexed, clusterIndexes(indexed.ids, assignment));
}

/** The same from an indexed level and each module's cluster as a small integer (below the module count). */
export function rankLevelGravity(level: LevelIndex, cluster: Int32Array): Map<string, GravityResult> {
  const own = level.modules;
  const ids = level.ids;
  const traffic = levelTraffic(level, cluster);
  const medians: LevelMedians = {
    callers: medianOf(traffic.callers),
    callees: medianOf(traffic.callees),
    weight: medianOf(traffic.weight),
    cyclomatic: medianOf(own.map((m) => m.cyclomatic)),
    functions: medianOf(own.map((m) => m.functions)),
    lines: medianOf(own.map((m) => m.lines)),
  };
  const otherClusters = Math.max(0, traffic.activeClusters - 1);

  const gravity = new Float64Array(own.length);
  const reasons: string[][] = [];
  own.forEach((m, i) => {
    const facts: GravityFacts = {
      callers: traffic.callers[i],
      callees: traffic.callees[i],
      callerClusters: traffic.callerClusters[i],
      calleeClusters: traffic.calleeClusters[i],
      cohesion: traffic.cohesion[i],
      weight: traffic.weight[i],
      cyclomatic: m.cyclomatic,
      functions: m.functions,
      lines: m.lines,
    };
    const components = gravityComponents(facts, medians, otherClusters);
    const points = gravityPoints(components);
    gravity[i] = gravityOf(points);
    reasons.push(gravityReasons(facts, components, points, medians, otherClusters));
  });

  const order = own.map((_, i) => i).sort((a, b) => gravity[b] - gravity[a] || compare(own[a].path, own[b].path) || compare(own[a].id, own[b].id));
  const result = new Map<string, GravityResult>();
  order.forEach((i, r) => {
    result.set(ids[i], { gravity: gravity[i], rank: r + 1, reasons: reasons[i], spread: traffic.spread[i], cohesion: traffic.cohesion[i] });
  });
  return result;
}

function compare(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}
