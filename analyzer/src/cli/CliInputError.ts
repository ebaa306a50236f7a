/** An input the CLI cannot use (an unreadable report or snapshot, a missing output folder). Exit code 2. */
export class CliInputError extends Error {
  override readonly name = 'CliInputError';

  /** @param reason one line (or a few) for people, naming the file (no module prefix) */
  constructor(readonly reason: string) {
    super(`analyzer/cli: ${reason}`);
  }
}
