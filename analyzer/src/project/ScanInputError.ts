/** The scan cannot start: a missing folder, an unreadable or invalid tsconfig. The message says which and why. */
export class ScanInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ScanInputError';
  }
}
