import type { SnapshotProblem } from './validateSnapshot';

/** A snapshot text that cannot be used: not JSON, another schema version, or schema problems. */
export class SnapshotInputError extends Error {
  override readonly name = 'SnapshotInputError';

  /**
   * @param reason what is wrong, for people (names the source, no module prefix)
   * @param problems the schema problems, when the text parsed but did not match
   */
  constructor(
    readonly reason: string,
    readonly problems: readonly SnapshotProblem[] = [],
  ) {
    super(`analyzer/snapshot: ${reason}`);
  }
}
