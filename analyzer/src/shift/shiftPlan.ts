/**
 * Shift of a carve plan
 * =====================
 * The same carve plan evaluated on two snapshots, side by side: per service (by name) the before
 * and after figures and the deltas of P, ΣV, Σ decisions, lines and S0; for the split as a whole
 * the deltas of the cut, chatter, cohesion, S1 across the boundaries and Q. A service present on
 * one side only has null on the other. The plan names modules by id, so a module that was renamed
 * or moved between the snapshots falls in "(unassigned)" after (listed in `after.unassigned`).
 * Snapshots counted under different settings are refused, as for shiftSnapshots.
 */
import { evaluateCarvePlan } from '../carve/evaluateCarvePlan';
import type { CarveEvaluation, CarvePlan, ServiceFigures } from '../carve/CarvePlan';
import type { Snapshot } from '../model';
import { assertComparable } from './shiftSnapshots';

/** One service of the plan on both snapshots. */
export interface ServiceShift {
  service: string;
  before: ServiceFigures | null;
  after: ServiceFigures | null;
  deltaFunctions: number;
  deltaCyclomatic: number;
  deltaDecisions: number;
  deltaLines: number;
  deltaDesignComplexity: number;
}

/** A carve plan evaluated on two snapshots, with the differences. */
export interface PlanShift {
  before: CarveEvaluation;
  after: CarveEvaluation;
  services: ServiceShift[];
  delta: { cutEdges: number; cutWeight: number; cutCalls: number; chatter: number; cohesion: number; integrationComplexity: number; modularity: number };
}

/** Evaluates `plan` on `before` and `after` and compares them (see the file header). */
export function shiftPlan(before: Snapshot, after: Snapshot, plan: CarvePlan): PlanShift {
  assertComparable(before, after);
  const was = evaluateCarvePlan(before, plan);
  const is = evaluateCarvePlan(after, plan);
  const names = [...new Set([...is.services.map((s) => s.service), ...was.services.map((s) => s.service)])];
  const find = (evaluation: CarveEvaluation, name: string) => evaluation.services.find((s) => s.service === name) ?? null;
  const services = names.map((service): ServiceShift => {
    const b = find(was, service);
    const a = find(is, service);
    const delta = (pick: (s: ServiceFigures) => number) => (a ? pick(a) : 0) - (b ? pick(b) : 0);
    return {
      service,
      before: b,
      after: a,
      deltaFunctions: delta((s) => s.functions),
      deltaCyclomatic: delta((s) => s.cyclomatic),
      deltaDecisions: delta((s) => s.decisions),
      deltaLines: delta((s) => s.lines),
      deltaDesignComplexity: delta((s) => s.designComplexity),
    };
  });
  return {
    before: was,
    after: is,
    services,
    delta: {
      cutEdges: is.cut.edges - was.cut.edges,
      cutWeight: is.cut.weight - was.cut.weight,
      cutCalls: is.cut.calls - was.cut.calls,
      chatter: is.chatter - was.chatter,
      cohesion: is.cohesion - was.cohesion,
      integrationComplexity: is.integrationComplexity - was.integrationComplexity,
      modularity: is.modularity - was.modularity,
    },
  };
}
