/**
 * Median
 * ======
 * The median of a list of numbers (the mean of the two middle values for an even count; 0 for
 * an empty list). One numeric sort of a typed copy: O(n log n), no comparisons through callbacks.
 */

/** The median of `values` (0 when there are none). */
export function medianOf(values: ArrayLike<number>): number {
  const n = values.length;
  if (n === 0) return 0;
  const sorted = Float64Array.from(values).sort();
  const mid = n >> 1;
  return n % 2 === 1 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}
