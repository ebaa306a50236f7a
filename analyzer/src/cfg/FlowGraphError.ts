/** A flow graph could not be built or read: an unsupported unit, a broken graph or compact form. */
export class FlowGraphError extends Error {
  constructor(message: string) {
    super(`analyzer/cfg: ${message}`);
    this.name = 'FlowGraphError';
  }
}
