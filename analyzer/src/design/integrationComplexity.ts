/**
 * Integration complexity S1
 * =========================
 * S1 = S0 − n + 1, where S0 = Σ iv(G) over n functions (design complexity). It is the number
 * of independent integration tests the design needs (a basis set of subtrees of the call
 * structure). Since every iv(G) ≥ 1, S0 ≥ n and S1 ≥ 1.
 *
 * [Reference]: McCabe & Butler, CACM 32(12), 1989; Watson & McCabe, NIST SP 500-235 (1996), §7.5.
 */

/** S1 = S0 − n + 1; throws RangeError when the inputs cannot come from iv values (S0 < n). */
export function integrationComplexity(s0: number, n: number): number {
  if (!Number.isInteger(s0) || !Number.isInteger(n) || n < 0 || s0 < n) {
    throw new RangeError(`analyzer/design: S0 = ${s0} over n = ${n} functions is impossible (each iv(G) ≥ 1, so S0 ≥ n)`);
  }
  return s0 - n + 1;
}
