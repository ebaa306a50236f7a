/**
 * The carve plan and its evaluation, as data: what the UI edits and what evaluateCarvePlan returns
 * (definitions in docs/metrics/carve.md).
 */
import type { ModuleLevel } from '../model';

/** The name of the service that holds every module a plan does not assign. */
export const UNASSIGNED_SERVICE = '(unassigned)';

/** Modules of one level assigned to proposed services. */
export interface CarvePlan {
  level: ModuleLevel;
  /** module id → service name */
  assignment: Record<string, string>;
}

/** One proposed service's figures. */
export interface ServiceFigures {
  service: string;
  modules: number;
  functions: number;
  cyclomatic: number;
  decisions: number;
  lines: number;
  designComplexity: number;
  /** share of its call weight that stays inside */
  cohesion: number;
  /** cross-service call sites per function */
  chatter: number;
  callsOut: number;
  callsIn: number;
}

/** A module whose weight mostly goes to another service than its own. */
export interface SuggestedMove {
  module: string;
  from: string;
  to: string;
  reason: string;
  /** Weight to `to` over the module's whole weight. */
  share: number;
}

/** The evaluation of a carve plan (see docs/metrics/carve.md). */
export interface CarveEvaluation {
  /** Sorted by name; "(unassigned)" last. */
  services: ServiceFigures[];
  /** Call edges (CallEdge entries) crossing services, their module-edge weight and their call sites. */
  cut: { edges: number; weight: number; calls: number };
  chatter: number;
  cohesion: number;
  /** S1 of the cross-service call graph: integration tests the split needs */
  integrationComplexity: number;
  modularity: number;
  suggestedMoves: SuggestedMove[];
  /** Module ids of the level that the plan does not assign. */
  unassigned: string[];
}
