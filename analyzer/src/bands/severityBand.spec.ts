import { SEVERITY_BANDS, severityBand } from './severityBand';

describe('severityBand', () => {
  it('should keep the published limit of 10 as the top of the calm band', () => {
    // McCabe 1976, IEEE TSE SE-2(4): 10 is "a reasonable, but not magical, upper limit".
    expect(severityBand(10)).toBe('calm');
    expect(severityBand(11)).toBe('busy');
  });

  it('should split at 20 and 50', () => {
    // common practice: the 1–10 / 11–20 / 21–50 / >50 split.
    expect([1, 20, 21, 50, 51, 400].map(severityBand)).toEqual(['calm', 'busy', 'tangled', 'tangled', 'knotted', 'knotted']);
  });

  it('should give a function with 25 consecutive ifs (V = 26) the tangled band', () => {
    // McCabe 1976 (reference-checks 1.8): 25 consecutive IF-THEN constructs have v = 26.
    expect(severityBand(26)).toBe('tangled');
  });

  it('should leave no gap between bands', () => {
    for (let i = 1; i < SEVERITY_BANDS.length; i++) {
      expect(SEVERITY_BANDS[i].min).toBe(SEVERITY_BANDS[i - 1].max + 1);
    }
  });

  it('should refuse values a control-flow graph cannot have', () => {
    expect(() => severityBand(0)).toThrow(/≥ 1/);
    expect(() => severityBand(2.5)).toThrow(RangeError);
  });
});
