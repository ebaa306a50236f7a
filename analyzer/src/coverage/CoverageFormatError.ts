/** A coverage report that cannot be read; `line` (lcov) or `where` (Istanbul JSON path) says where. */
export class CoverageFormatError extends Error {
  constructor(
    reason: string,
    /** 1-based line of the report text, when the format is line-based. */
    readonly line?: number,
    /** Where inside a JSON report, e.g. `src/a.ts › branchMap › 3`. */
    readonly where?: string,
  ) {
    super(`analyzer/coverage: ${line !== undefined ? `line ${line}: ` : ''}${where !== undefined ? `${where}: ` : ''}${reason}`);
    this.name = 'CoverageFormatError';
  }
}
