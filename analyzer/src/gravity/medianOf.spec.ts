import { medianOf } from './medianOf';

describe('medianOf', () => {
  it('should take the middle value, the mean of the two middle ones, or 0 for none', () => {
    expect(medianOf([5, 1, 3])).toBe(3);
    expect(medianOf(new Int32Array([4, 1, 3, 10]))).toBe(3.5);
    expect(medianOf([])).toBe(0);
  });
});
