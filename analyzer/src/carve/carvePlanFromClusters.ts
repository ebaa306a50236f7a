/**
 * A first plan from the clusters
 * ==============================
 * Turns the snapshot's clusters at one level into a carve plan: each cluster becomes a service
 * named after its largest member's path (largest by ΣV, then by functions, then the first path
 * in order), or after the cluster id when none of its members is a module of the snapshot. A
 * name already taken gets the cluster id added in parentheses. Modules in no cluster stay
 * unassigned. Gives an architect a starting split to edit rather than an empty plan.
 */
import type { ModuleLevel, ModuleRecord, Snapshot } from '../model';
import type { CarvePlan } from './CarvePlan';

/** Each cluster of `level` as a service (see the file header). */
export function carvePlanFromClusters(snapshot: Snapshot, level: ModuleLevel): CarvePlan {
  const modules = new Map<string, ModuleRecord>();
  for (const m of snapshot.modules ?? []) if (m.level === level) modules.set(m.id, m);
  const assignment: Record<string, string> = {};
  const taken = new Set<string>();
  for (const cluster of snapshot.clusters ?? []) {
    if (cluster.level !== level) continue;
    const largest = cluster.members
      .map((id) => modules.get(id))
      .filter((m): m is ModuleRecord => m !== undefined)
      .sort((a, b) => b.cyclomatic - a.cyclomatic || b.functions - a.functions || (a.path < b.path ? -1 : a.path > b.path ? 1 : 0))[0];
    let name = largest?.path ?? cluster.id;
    if (taken.has(name)) name = `${name} (${cluster.id})`;
    taken.add(name);
    for (const id of cluster.members) assignment[id] = name;
  }
  return { level, assignment };
}
