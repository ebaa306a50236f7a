/**
 * Severity bands for V(G)
 * =======================
 * Places a function's cyclomatic complexity in one of four bands, using the widely published
 * split 1–10 / 11–20 / 21–50 / above 50 under Seamline's own words. The bands are guidance,
 * not verdicts: a large flat switch reads more simply than its number suggests.
 *
 * [Reference]: McCabe 1976 (IEEE TSE SE-2(4)) and NIST SP 500-235 §2.5 give 10 as the limit;
 * the further 20/50 cut points are common practice.
 */

export type SeverityBand = 'calm' | 'busy' | 'tangled' | 'knotted';

/** Each band with the highest V(G) it holds (knotted has no upper bound). */
export const SEVERITY_BANDS: readonly { band: SeverityBand; min: number; max: number }[] = [
  { band: 'calm', min: 1, max: 10 },
  { band: 'busy', min: 11, max: 20 },
  { band: 'tangled', min: 21, max: 50 },
  { band: 'knotted', min: 51, max: Number.POSITIVE_INFINITY },
];

/** The band of a cyclomatic complexity; throws on a value no control-flow graph can have. */
export function severityBand(cyclomatic: number): SeverityBand {
  if (!Number.isInteger(cyclomatic) || cyclomatic < 1) {
    throw new RangeError(`analyzer/severityBand: V(G) must be an integer ≥ 1, got ${cyclomatic}`);
  }
  return SEVERITY_BANDS.find((b) => cyclomatic <= b.max)!.band;
}
