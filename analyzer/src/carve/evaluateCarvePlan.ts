/**
 * Carve-plan evaluation
 * =====================
 * A carve plan assigns the modules of one level to proposed services. Its evaluation gives, per
 * service, P, ΣV, Σ decisions, lines and S0, and for the split as a whole the cut (call edges
 * and module-edge weight crossing services), chatter, cohesion, the integration complexity of
 * the cross-service calls, the modularity Q of the partition, and suggested moves. Modules the
 * plan leaves out (and functions no module claims) form one "(unassigned)" service, so the
 * services always add up to the codebase. Definitions and a worked example: docs/metrics/carve.md.
 *
 * For live editing, `prepareCarve` once per snapshot and level, then `evaluateCarve` per edit.
 *
 * [Reference]: McCabe & Butler 1989, CACM 32(12); Watson & McCabe, NIST SP 500-235 §7.4–7.5
 * (S0, S1 — adapted to the cross-service call graph, see carve.md); Newman 2006, PNAS 103(23) (Q).
 */
import type { Snapshot } from '../model';
import type { CarveEvaluation, CarvePlan } from './CarvePlan';
import { evaluateCarve } from './evaluateCarve';
import { prepareCarve } from './prepareCarve';

export { carvePlanFromClusters } from './carvePlanFromClusters';
export { evaluateCarve } from './evaluateCarve';
export { prepareCarve } from './prepareCarve';
export type { CarveIndex } from './prepareCarve';
export { UNASSIGNED_SERVICE } from './CarvePlan';
export type { CarveEvaluation, CarvePlan, ServiceFigures, SuggestedMove } from './CarvePlan';

/** Evaluates `plan` on `snapshot` (prepare and evaluate in one; use the two steps for live editing). */
export function evaluateCarvePlan(snapshot: Snapshot, plan: CarvePlan): CarveEvaluation {
  return evaluateCarve(prepareCarve(snapshot, plan.level), plan);
}
