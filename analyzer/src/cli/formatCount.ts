/**
 * A whole number with thousands separators: 11208 → `11,208`, as `Intl.NumberFormat('en-US')`
 * writes it (formatCount.spec.ts checks the two agree). Written out because the first
 * `Intl.NumberFormat` of a process costs ~20 ms, and every command prints a count.
 */
export function formatCount(n: number): string {
  if (!Number.isFinite(n)) return new Intl.NumberFormat('en-US').format(n);
  // Halves away from zero, as Intl rounds.
  const whole = Math.round(Math.abs(n));
  if (whole >= 1e21) return new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 }).format(n);
  const grouped = String(whole).replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  // Intl keeps the sign of a negative number that rounds to zero (`-0`).
  return n < 0 || Object.is(n, -0) ? `-${grouped}` : grouped;
}

/** `1 function`, `4,120 functions`: a count with its noun, singular for exactly one. */
export function countOf(n: number, singular: string, plural = `${singular}s`): string {
  return `${formatCount(n)} ${n === 1 ? singular : plural}`;
}
