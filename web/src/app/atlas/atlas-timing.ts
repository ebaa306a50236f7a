/**
 * User Timing marks for the Atlas (the browser benchmark reads them; the browser's performance
 * panel shows them too). Times are the browser's own `performance.now()`, so nothing here waits.
 */
export type AtlasMark = 'data' | 'first-frame' | 'layout-start' | 'layout-end';

/** The mark's full name, e.g. `seamline:atlas:first-frame`. */
export function atlasMarkName(mark: AtlasMark): string {
  return `seamline:atlas:${mark}`;
}

/** Records a mark; a browser without the User Timing API simply records nothing. */
export function markAtlas(mark: AtlasMark): void {
  globalThis.performance?.mark?.(atlasMarkName(mark));
}

/** Records `first-frame` once the browser has painted what sigma drew synchronously. */
export function markFirstFrame(): void {
  if (typeof requestAnimationFrame !== 'function') return markAtlas('first-frame');
  // The frame painted after this callback is the first one with the map on it.
  requestAnimationFrame(() => setTimeout(() => markAtlas('first-frame'), 0));
}
