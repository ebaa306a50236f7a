import type { GravityTrendPoint } from './gravity-types';

/** Size of a sparkline in SVG units, and the room kept free around the line. */
export interface SparklineBox {
  width: number;
  height: number;
  padding: number;
}

/** One plotted snapshot: where it sits and what it shows. */
export interface SparklinePoint {
  x: number;
  y: number;
  gravity: number;
  /** Whether this is the snapshot in view (the last point). */
  isCurrent: boolean;
}

/** What to draw: one SVG path per run of snapshots that have the module, and a dot per value. */
export interface SparklineGeometry {
  /** `d` attributes; a snapshot without the module breaks the line. */
  paths: string[];
  points: SparklinePoint[];
  /** y of the bottom and the top of the drawn range. */
  baseline: number;
  top: number;
  /** The gravity range drawn from bottom to top. */
  low: number;
  high: number;
}

/** The default sparkline size. */
export const SPARKLINE_BOX: SparklineBox = { width: 112, height: 30, padding: 3 };

/** The narrowest gravity range a sparkline spans, so a change of a point or two stays a small step. */
export const MIN_SPAN = 20;

/**
 * Places a trend in a box, snapshots evenly spaced from left (oldest) to right (the snapshot in
 * view). Height shows the range of the module's own values, widened to at least MIN_SPAN points
 * of the 0–100 scale around their middle, so changes can be seen without blowing up noise.
 */
export function sparklineGeometry(trend: readonly GravityTrendPoint[], box: SparklineBox = SPARKLINE_BOX): SparklineGeometry {
  const { width, height, padding } = box;
  const baseline = height - padding;
  const top = padding;
  const step = trend.length > 1 ? (width - 2 * padding) / (trend.length - 1) : 0;
  const values = trend.flatMap((entry) => (entry.gravity === null ? [] : [clamp(entry.gravity)]));
  const [low, high] = drawnRange(values);
  const points: SparklinePoint[] = [];
  const paths: string[] = [];
  let run: string[] = [];
  const closeRun = () => {
    if (run.length > 1) paths.push(run.join(' '));
    run = [];
  };
  trend.forEach((entry, index) => {
    if (entry.gravity === null) {
      closeRun();
      return;
    }
    const x = round(padding + index * step);
    const y = round(baseline - ((clamp(entry.gravity) - low) / (high - low)) * (baseline - top));
    points.push({ x, y, gravity: entry.gravity, isCurrent: index === trend.length - 1 });
    run.push(`${run.length === 0 ? 'M' : 'L'}${x},${y}`);
  });
  closeRun();
  return { paths, points, baseline, top, low, high };
}

/** The values' own range widened to MIN_SPAN around its middle, kept inside 0–100. */
function drawnRange(values: readonly number[]): [number, number] {
  if (values.length === 0) return [0, 100];
  let low = Math.min(...values);
  let high = Math.max(...values);
  if (high - low < MIN_SPAN) {
    const middle = (low + high) / 2;
    low = middle - MIN_SPAN / 2;
    high = middle + MIN_SPAN / 2;
    if (low < 0) [low, high] = [0, MIN_SPAN];
    if (high > 100) [low, high] = [100 - MIN_SPAN, 100];
  }
  return [low, high];
}

function clamp(value: number): number {
  return Math.min(100, Math.max(0, value));
}

/**
 * The trend in one sentence for screen readers and tooltips, or null when there is nothing to
 * compare (a single snapshot). Compares the earliest snapshot that has the module with this one.
 */
export function describeTrend(trend: readonly GravityTrendPoint[]): string | null {
  if (trend.length < 2) return null;
  const present = trend.filter((entry): entry is GravityTrendPoint & { gravity: number } => entry.gravity !== null);
  const current = trend[trend.length - 1].gravity;
  const earlier = trend.length - 1;
  const missing = trend.slice(0, -1).filter((entry) => entry.gravity === null).length;
  if (current === null) return null;
  if (present.length === 1) {
    return `Gravity ${format(current)}; the module is not in the ${plural(earlier, 'earlier snapshot')}`;
  }
  const first = present[0].gravity;
  const delta = round1(current - first);
  const absent = missing > 0 ? `, absent from ${missing} of them` : '';
  const span = `over ${plural(trend.length, 'snapshot')}${absent}`;
  if (delta === 0) return `Gravity unchanged at ${format(current)} ${span}`;
  return `Gravity ${delta > 0 ? 'rose' : 'fell'} from ${format(first)} to ${format(current)} ${span}`;
}

/** Whether earlier snapshots exist and none of them has the module: it is new in the snapshot in view. */
export function isNewModule(trend: readonly GravityTrendPoint[]): boolean {
  return trend.length > 1 && trend[trend.length - 1].gravity !== null && trend.slice(0, -1).every((entry) => entry.gravity === null);
}

/** The change since the earliest snapshot with the module, as a short signed figure ("+3.9"); null if there is none to compare. */
export function trendChange(trend: readonly GravityTrendPoint[]): string | null {
  if (trend.length < 2 || isNewModule(trend)) return null;
  const current = trend[trend.length - 1].gravity;
  const first = trend.find((entry) => entry.gravity !== null)?.gravity ?? null;
  if (current === null || first === null) return null;
  const delta = round1(current - first);
  return delta === 0 ? '±0' : `${delta > 0 ? '+' : '−'}${format(Math.abs(delta))}`;
}

function format(value: number): string {
  return round1(value).toLocaleString('en-GB', { maximumFractionDigits: 1 });
}

function plural(count: number, noun: string): string {
  return `${count} ${noun}${count === 1 ? '' : 's'}`;
}

function round1(value: number): number {
  return Math.round(value * 10) / 10;
}

function round(value: number): number {
  return Math.round(value * 100) / 100;
}
