import { crap } from './crap';

describe('crap', () => {
  // Savoia 2007 formula comp² × (1 − cov)³ + comp; values DERIVED in reference-checks.md §7.
  it.each([
    [1, 0, 2],
    [5, 0, 30],
    [6, 0, 42],
    [10, 0, 110],
    [10, 0.5, 22.5],
    [10, 1, 10],
    [15, 0, 240],
    [20, 0, 420],
    [30, 1, 30],
  ])('comp %s at coverage %s gives %s (reference-checks §7, Savoia 2007)', (comp, cov, expected) => {
    expect(crap(comp, cov)).toBeCloseTo(expected, 10);
  });

  // reference-checks §7 (DERIVED): least coverage for CRAP ≤ 30, given to two decimals of a percent.
  it.each([
    [10, 0.4152],
    [15, 0.5945],
    [20, 0.7076],
    [25, 0.8],
  ])('comp %s needs about %s coverage to reach 30 (reference-checks §7)', (comp, cov) => {
    expect(crap(comp, cov)).toBeCloseTo(30, 1);
    expect(crap(comp, cov - 0.001)).toBeGreaterThan(30);
  });

  it('never drops below the complexity, so comp ≥ 31 cannot reach 30 (reference-checks §7)', () => {
    expect(crap(31, 1)).toBe(31);
    expect(crap(5, 0)).toBe(30); // exactly 30: not over the "> 30" line
  });

  it('refuses values no function can have', () => {
    expect(() => crap(0, 0.5)).toThrow(/analyzer\/coverage: complexity/);
    expect(() => crap(3, 1.2)).toThrow(/coverage must be a fraction/);
    expect(() => crap(3, Number.NaN)).toThrow(RangeError);
  });
});
