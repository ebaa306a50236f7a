/** The modules, edges or cluster assignment handed to the gravity ranking do not fit together. */
export class GravityInputError extends Error {
  constructor(message: string) {
    super(`analyzer/gravity: ${message}`);
    this.name = 'GravityInputError';
  }
}
