/** The commands of the `seamline` CLI. */
export type CommandName = 'scan' | 'check' | 'push';

/** A command line Seamline cannot run: unknown option, missing value, bad value. Exit code 2. */
export class UsageError extends Error {
  override readonly name = 'UsageError';

  /**
   * @param reason one line for people (no module prefix)
   * @param command the command whose help the hint points to, when known
   */
  constructor(
    readonly reason: string,
    readonly command?: CommandName,
  ) {
    super(`analyzer/cli: ${reason}`);
  }

  /** The line after the reason: where to read the usage. */
  get hint(): string {
    return `Run \`seamline ${this.command ? `${this.command} ` : ''}--help\` for usage.`;
  }
}
