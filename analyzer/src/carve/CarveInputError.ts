/** A carve plan that does not fit the snapshot it is evaluated on (wrong level, a service name that is not text). */
export class CarveInputError extends Error {
  override readonly name = 'CarveInputError';

  constructor(message: string) {
    super(`analyzer/carve: ${message}`);
  }
}
