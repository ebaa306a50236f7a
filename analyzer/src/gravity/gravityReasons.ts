/**
 * Gravity reasons
 * ===============
 * The plain-language reasons behind one module's gravity: one sentence per component that
 * drove the score (at least NOTABLE_SHARE of its range), strongest first (ties in the order of
 * GRAVITY_WEIGHTS), each with its numbers: "called from 7 of 8 other clusters", "ΣV 412, 6× the
 * median module", "only 18 % of its call weight stays in its cluster", "48 functions, 1,930
 * lines". A module where no component stands out gets one calm sentence saying where its
 * traffic stays, or that it has none.
 */
import { GRAVITY_WEIGHTS, NOTABLE_SHARE, type GravityComponent, type GravityFacts, type LevelMedians } from './gravityScore';

const ORDER = Object.keys(GRAVITY_WEIGHTS) as GravityComponent[];
const NUMBER = new Intl.NumberFormat('en-US', { maximumFractionDigits: 1 });

/** Reasons for a module with these facts, components (0–1) and points. */
export function gravityReasons(
  facts: GravityFacts,
  components: Record<GravityComponent, number>,
  points: Record<GravityComponent, number>,
  medians: LevelMedians,
  otherClusters: number,
): string[] {
  const drivers = ORDER.filter((key) => components[key] >= NOTABLE_SHARE).sort((a, b) => points[b] - points[a] || ORDER.indexOf(a) - ORDER.indexOf(b));
  if (drivers.length === 0) {
    return [facts.weight === 0 ? 'no calls to or from other modules at this level' : `keeps ${percent(facts.cohesion)} of its call weight in its cluster`];
  }
  return drivers.map((key) => sentence(key, facts, medians, otherClusters));
}

function sentence(key: GravityComponent, facts: GravityFacts, medians: LevelMedians, otherClusters: number): string {
  switch (key) {
    case 'callerClusters':
      return `called from ${NUMBER.format(facts.callerClusters)} of ${plural(otherClusters, 'other cluster')}`;
    case 'calleeClusters':
      return `calls into ${NUMBER.format(facts.calleeClusters)} of ${plural(otherClusters, 'other cluster')}`;
    case 'callers':
      return `called by ${plural(facts.callers, 'other module')}, ${against(facts.callers, medians.callers)}`;
    case 'callees':
      return `calls ${plural(facts.callees, 'other module')}, ${against(facts.callees, medians.callees)}`;
    case 'openness':
      return `only ${percent(facts.cohesion)} of its call weight stays in its cluster`;
    case 'cyclomatic':
      return `ΣV ${NUMBER.format(facts.cyclomatic)}, ${against(facts.cyclomatic, medians.cyclomatic)}`;
    case 'size':
      return `${plural(facts.functions, 'function')}, ${plural(facts.lines, 'line')}`;
  }
}

/** "6× the median module", or the median itself when it is below 1 (no meaningful ratio). */
function against(value: number, median: number): string {
  if (median === 0) return 'where the median module has none';
  if (median < 1) return `where the median module has ${NUMBER.format(median)}`;
  const r = value / median;
  return `${r >= 10 ? Math.round(r).toString() : NUMBER.format(Math.round(r * 10) / 10)}× the median module`;
}

function plural(n: number, noun: string): string {
  return `${NUMBER.format(n)} ${n === 1 ? noun : `${noun}s`}`;
}

function percent(share: number): string {
  return `${Math.round(share * 100)} %`;
}
