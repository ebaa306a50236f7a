import { createHash } from 'node:crypto';
import { unitId } from './unitId';

describe('unitId', () => {
  it('keeps the ids earlier snapshots carry (the first 16 base64url characters of SHA-256)', () => {
    expect(unitId('src/orders/OrderService.ts', 'OrderService.assignCourier', 0)).toBe('jbMOC1_IEKExQuAf');
    const expected = createHash('sha256').update('src/a.ts\0<anonymous>.<anonymous>\u00003').digest('base64url').slice(0, 16);
    expect(unitId('src/a.ts', '<anonymous>.<anonymous>', 3)).toBe(expected);
  });

  it('tells apart the file, the name and the ordinal', () => {
    const ids = new Set([unitId('a.ts', 'f', 0), unitId('a.ts', 'f', 1), unitId('b.ts', 'f', 0), unitId('a.ts', 'g', 0), unitId('a.ts\0f', '', 0)]);
    expect(ids.size).toBe(5);
  });
});
