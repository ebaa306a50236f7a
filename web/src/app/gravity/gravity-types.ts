/** Shapes of `GET /api/snapshots/:id/gravity` (see docs/openapi.yaml → GravityRanking). */

/** The level a module map is drawn at. */
export type ModuleLevel = 'file' | 'folder' | 'package';

/** Every level, in the order the screen offers them. */
export const MODULE_LEVELS: readonly ModuleLevel[] = ['file', 'folder', 'package'];

/** The level the server uses when none is asked for. */
export const DEFAULT_LEVEL: ModuleLevel = 'folder';

/** A module's gravity in one snapshot of its codebase. */
export interface GravityTrendPoint {
  snapshotId: string;
  /** When that snapshot was made; null for the snapshot in view (the last point). */
  createdAt: string | null;
  /** Null when the module did not exist at this level in that snapshot. */
  gravity: number | null;
}

/** One module of the ranking with its figures, its reasons and its trend. */
export interface GravityModule {
  /** Stable module id, e.g. `folder:src/orders`. */
  id: string;
  level?: ModuleLevel;
  path: string;
  /** Package name, for package modules that declare one. */
  name: string | null;
  /** P: functions (connected components). */
  functions: number;
  /** ΣV: the sum of V(G) over its functions. */
  cyclomatic: number;
  /** Σπ: decisions. */
  decisions: number;
  /** The largest V(G) of its functions. */
  maxCyclomatic: number;
  /** Functions over the limit. */
  overLimit: number;
  lines?: number;
  /** Call sites from other modules of the level into this one. */
  fanIn: number;
  /** Call sites from this one into other modules of the level. */
  fanOut: number;
  /** Distinct modules depending on this one. */
  ca: number;
  /** Distinct modules this one depends on. */
  ce: number;
  /** I = Ce/(Ca+Ce); null with neither. */
  instability: number | null;
  /** S0. */
  designComplexity: number;
  /** S1 = S0 − n + 1. */
  integrationComplexity: number;
  cluster: string | null;
  /** 0–100. */
  gravity: number;
  /** 1 is the strongest god-module candidate of the level. */
  gravityRank: number;
  /** The components behind the score, strongest first, in words. */
  reasons: string[];
  /** Up to five earlier ready snapshots (oldest first), then the snapshot in view. */
  trend: GravityTrendPoint[];
}

/** `GET /api/snapshots/:id/gravity` → 200. */
export interface GravityRanking {
  level: ModuleLevel;
  modules: GravityModule[];
}
