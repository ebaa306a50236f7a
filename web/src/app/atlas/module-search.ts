import { moduleLabel, type ModuleNode } from './module-graph';

/**
 * The modules a search and the ΣV filter leave, in the given order: the query matches any part
 * of the path or name, ignoring case; the selected module is always kept (it stays on the map).
 */
export function matchModules(
  modules: readonly ModuleNode[],
  query: string,
  minCyclomatic: number,
  selected: string | null = null,
): readonly ModuleNode[] {
  const needle = query.trim().toLowerCase();
  if (needle === '' && minCyclomatic <= 0) return modules;
  return modules.filter(
    (m) =>
      (m.id === selected || m.cyclomatic >= minCyclomatic) &&
      (needle === '' || m.path.toLowerCase().includes(needle) || moduleLabel(m).toLowerCase().includes(needle)),
  );
}

/** At most `limit` suggestions for the search field: modules whose name starts with the query first. */
export function suggestModules(matches: readonly ModuleNode[], query: string, limit: number): ModuleNode[] {
  const needle = query.trim().toLowerCase();
  if (needle === '') return [];
  const starts: ModuleNode[] = [];
  const rest: ModuleNode[] = [];
  for (const m of matches) {
    const tail = moduleLabel(m).toLowerCase().split('/').pop() ?? '';
    (tail.startsWith(needle) ? starts : rest).push(m);
    if (starts.length >= limit) break;
  }
  return [...starts, ...rest].slice(0, limit);
}
