/** Two snapshots counted under different settings: their V(G) values cannot be compared. */
export class IncomparableShiftError extends Error {
  override readonly name = 'IncomparableShiftError';

  /** @param differences each differing setting as `name: before → after` */
  constructor(readonly differences: readonly string[]) {
    super(`analyzer/shift: the two snapshots were counted under different settings (${differences.join('; ')}), so their V(G) values are not comparable`);
  }
}
