/**
 * Gravity score
 * =============
 * Seamline's own god-module score, 0–100: a weighted sum of seven components, each normalised
 * to 0–1 and capped, so that no single trait can carry a module to the top. Reaching into many
 * clusters (both ways), being used and using many modules, letting its traffic leave its
 * cluster, and being large all add up; a large module that little calls or is called by can
 * collect at most the size points (25). The formula, with a worked example, is in
 * docs/metrics/gravity.md; the constants below are that page's table.
 * - callerClusters: other clusters its callers sit in, over the other active clusters (at least 4);
 * - calleeClusters: the same for the clusters it calls into;
 * - callers / callees: distinct calling / called modules over 5× the level's median module;
 * - openness: 1 − cohesion, scaled down for a module with less edge weight than the median
 *   module (a module with one foreign edge says little about its cluster);
 * - cyclomatic: ΣV over 5× the median module's ΣV;
 * - size: functions or lines, whichever is larger against its median, over 5×.
 * Medians below 1 count as 1 (a level where most modules have no callers still has a scale).
 *
 * [Reference]: our own (docs/metrics/gravity.md); the ingredients are ΣV (McCabe 1976) and fan-in /
 * fan-out of the module graph.
 */

/** Points each component adds at its cap; they sum to 100. */
export const GRAVITY_WEIGHTS = Object.freeze({
  callerClusters: 25,
  calleeClusters: 15,
  callers: 15,
  callees: 10,
  openness: 10,
  cyclomatic: 15,
  size: 10,
});

export type GravityComponent = keyof typeof GRAVITY_WEIGHTS;

/** A module at this many times the median module gets a ratio component's full points. */
export const RATIO_CAP = 5;
/** Cluster reach is divided by the other active clusters, but by at least this many. */
export const MIN_OTHER_CLUSTERS = 4;
/** A component at or above this share of its range is named among the reasons. */
export const NOTABLE_SHARE = 0.4;
/** Gravity from which a module is a strong god-module candidate (documented guidance). */
export const STRONG_CANDIDATE = 50;

/** What the score reads of one module. */
export interface GravityFacts {
  callers: number;
  callees: number;
  callerClusters: number;
  calleeClusters: number;
  cohesion: number;
  weight: number;
  cyclomatic: number;
  functions: number;
  lines: number;
}

/** The level's median module (each value as measured, before flooring at 1). */
export type LevelMedians = Pick<GravityFacts, 'callers' | 'callees' | 'weight' | 'cyclomatic' | 'functions' | 'lines'>;

/** Each component of `facts`, 0–1. `otherClusters`: active clusters at the level minus one. */
export function gravityComponents(facts: GravityFacts, medians: LevelMedians, otherClusters: number): Record<GravityComponent, number> {
  const reach = Math.max(otherClusters, MIN_OTHER_CLUSTERS);
  const ratio = (value: number, median: number) => Math.min(1, value / Math.max(1, median) / RATIO_CAP);
  return {
    callerClusters: Math.min(1, facts.callerClusters / reach),
    calleeClusters: Math.min(1, facts.calleeClusters / reach),
    callers: ratio(facts.callers, medians.callers),
    callees: ratio(facts.callees, medians.callees),
    openness: (1 - facts.cohesion) * Math.min(1, facts.weight / Math.max(1, medians.weight)),
    cyclomatic: ratio(facts.cyclomatic, medians.cyclomatic),
    size: Math.max(ratio(facts.functions, medians.functions), ratio(facts.lines, medians.lines)),
  };
}

/** Points per component (component × its weight). */
export function gravityPoints(c: Record<GravityComponent, number>): Record<GravityComponent, number> {
  const w = GRAVITY_WEIGHTS;
  // NOTE: written out rather than looped over the keys: this runs once per module on maps of 10^5 modules.
  return {
    callerClusters: c.callerClusters * w.callerClusters,
    calleeClusters: c.calleeClusters * w.calleeClusters,
    callers: c.callers * w.callers,
    callees: c.callees * w.callees,
    openness: c.openness * w.openness,
    cyclomatic: c.cyclomatic * w.cyclomatic,
    size: c.size * w.size,
  };
}

/** The score: the points summed, rounded to one decimal. */
export function gravityOf(p: Record<GravityComponent, number>): number {
  const sum = p.callerClusters + p.calleeClusters + p.callers + p.callees + p.openness + p.cyclomatic + p.size;
  return Math.round(sum * 10) / 10;
}
