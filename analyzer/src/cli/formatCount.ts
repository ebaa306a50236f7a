const GROUPED = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });

/** A whole number with thousands separators: 11208 → `11,208`. */
export function formatCount(n: number): string {
  return GROUPED.format(n);
}

/** `1 function`, `4,120 functions`: a count with its noun, singular for exactly one. */
export function countOf(n: number, singular: string, plural = `${singular}s`): string {
  return `${formatCount(n)} ${n === 1 ? singular : plural}`;
}
