/**
 * CRAP score
 * ==========
 * Change Risk Anti-Patterns: comp² × (1 − cov)³ + comp, with cov the covered share (0…1).
 * Untested complex code scores high; at full coverage the score equals the complexity.
 * Seamline takes comp = V(G) and cov = covered decision outcomes over all outcomes.
 *
 * [Reference]: A. Savoia, "Pardon My French, But This Code Is C.R.A.P. (2)", Artima blog, 2007.
 */

/** CRAP for a complexity ≥ 1 and a coverage fraction in [0, 1]. */
export function crap(complexity: number, coverageFraction: number): number {
  if (!Number.isFinite(complexity) || complexity < 1) {
    throw new RangeError(`analyzer/coverage: complexity must be ≥ 1, got ${complexity}`);
  }
  if (!(coverageFraction >= 0 && coverageFraction <= 1)) {
    throw new RangeError(`analyzer/coverage: coverage must be a fraction in [0, 1], got ${coverageFraction}`);
  }
  return complexity * complexity * (1 - coverageFraction) ** 3 + complexity;
}
