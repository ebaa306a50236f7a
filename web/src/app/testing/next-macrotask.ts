/** Resolves after pending microtasks (e.g. a router navigation reaching its guards) have run. */
export function nextMacrotask(): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, 0));
}
