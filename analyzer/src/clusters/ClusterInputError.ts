/** The modules, edges or partition handed to clustering or modularity do not fit together. */
export class ClusterInputError extends Error {
  constructor(message: string) {
    super(`analyzer/clusters: ${message}`);
    this.name = 'ClusterInputError';
  }
}
