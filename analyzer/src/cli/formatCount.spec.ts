import { countOf, formatCount } from './formatCount';

// The reference: the engine's own number formatting (ECMA-402), which formatCount avoids only for its start-up cost.
const intl = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });

describe('formatCount', () => {
  it('should group thousands as Intl.NumberFormat(en-US) does', () => {
    const samples = [0, 1, 9, 10, 99, 100, 999, 1000, 1001, 9999, 10000, 11208, 99999, 100000, 999999, 1000000, 1234567, 12345678, 123456789, 2 ** 31, 2 ** 53 - 1, 1e20];
    for (const n of [...samples, ...samples.map((x) => -x)]) expect(formatCount(n)).toBe(intl.format(n));
  });

  it('should round as Intl.NumberFormat does, halves away from zero', () => {
    for (const n of [0.4, 0.5, 1.5, 2.5, 999.5, 1234.49, -0.4, -0.5, -2.5, -999.5]) expect(formatCount(n)).toBe(intl.format(n));
  });

  it('should agree on numbers beyond the plain digits too', () => {
    for (const n of [Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY, Number.NaN, 1e21, 1.5e25]) expect(formatCount(n)).toBe(intl.format(n));
  });

  it('should name the noun in the singular for exactly one', () => {
    expect(countOf(1, 'function')).toBe('1 function');
    expect(countOf(4120, 'function')).toBe('4,120 functions');
    expect(countOf(2, 'class', 'classes')).toBe('2 classes');
  });
});
