import type { ClusterSummary, ModuleLevel, ModuleOption } from './functions-types';

/** Most module suggestions shown per level while typing. */
export const MODULE_SUGGESTIONS_PER_LEVEL = 30;

/** Module suggestions of one level. */
export interface ModuleGroup {
  level: ModuleLevel;
  label: string;
  modules: ModuleOption[];
}

const LEVEL_LABELS: Record<ModuleLevel, string> = { package: 'Packages', folder: 'Folders', file: 'Files' };

/** The modules whose path contains `text` (any case), grouped by level, at most `perLevel` each. */
export function moduleGroups(
  modules: readonly ModuleOption[],
  text: string,
  perLevel = MODULE_SUGGESTIONS_PER_LEVEL,
): ModuleGroup[] {
  const needle = text.trim().toLowerCase();
  const groups: ModuleGroup[] = [];
  for (const level of ['package', 'folder', 'file'] as const) {
    const found = modules.filter((m) => m.level === level && m.path.toLowerCase().includes(needle));
    if (found.length > 0) groups.push({ level, label: LEVEL_LABELS[level], modules: found.slice(0, perLevel) });
  }
  return groups;
}

/** How a module reads in the filter, e.g. `folder src/orders`. */
export function moduleLabel(module: Pick<ModuleOption, 'level' | 'path'>): string {
  return `${module.level} ${module.path}`;
}

/** How a module id reads when its module is not (yet) known, e.g. `folder:src/orders` → `folder src/orders`. */
export function moduleIdLabel(id: string): string {
  const colon = id.indexOf(':');
  return colon < 0 ? id : `${id.slice(0, colon)} ${id.slice(colon + 1)}`;
}

/**
 * A cluster's name in the filter: its id, the folder most of its files sit in, and its size,
 * e.g. `c1 · mostly src/dispatch-core · 155 functions`.
 */
export function clusterLabel(cluster: ClusterSummary): string {
  const counts = new Map<string, number>();
  for (const member of cluster.members) {
    const path = member.replace(/^file:/, '');
    const slash = path.lastIndexOf('/');
    const folder = slash < 0 ? '(root)' : path.slice(0, slash);
    counts.set(folder, (counts.get(folder) ?? 0) + 1);
  }
  let top: string | null = null;
  let topCount = 0;
  for (const [folder, count] of counts) {
    if (count > topCount || (count === topCount && top !== null && folder < top)) {
      top = folder;
      topCount = count;
    }
  }
  const where = top === null ? '' : ` · mostly ${top}`;
  const size = `${cluster.functions.toLocaleString('en')} function${cluster.functions === 1 ? '' : 's'}`;
  return `${cluster.id}${where} · ${size}`;
}
