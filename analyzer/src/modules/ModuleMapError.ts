/** The module map cannot be built from its input: a bad setting, or records that contradict each other (a bug upstream). */
export class ModuleMapError extends Error {
  constructor(message: string) {
    super(`analyzer/modules: ${message}`);
    this.name = 'ModuleMapError';
  }
}
