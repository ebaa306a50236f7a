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

/** Resolves once the browser has painted what was drawn so far (the next frame, then its task). */
export function afterNextPaint(): Promise<void> {
  return new Promise((resolve) => {
    if (typeof requestAnimationFrame !== 'function') return void setTimeout(resolve, 0);
    // A task queued from a frame callback runs after that frame has been produced.
    requestAnimationFrame(() => setTimeout(resolve, 0));
  });
}
