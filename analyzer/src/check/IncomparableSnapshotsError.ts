/** A baseline counted under other settings than the snapshot: their V(G) values cannot be compared. */
export class IncomparableSnapshotsError extends Error {
  override readonly name = 'IncomparableSnapshotsError';

  /** @param differences each differing setting as `name: baseline → current` */
  constructor(readonly differences: readonly string[]) {
    super(
      `analyzer/check: the snapshot and the baseline were counted under different settings ` +
        `(${differences.join('; ')}), so their V(G) values are not comparable`,
    );
  }
}
