/**
 * What changed between two snapshots, as data (definitions in docs/metrics/shift.md).
 */

/** How a function of one snapshot relates to the other. */
export type FunctionShiftStatus = 'same' | 'changed' | 'added' | 'removed' | 'moved' | 'renamed';

/** 'up': went over the limit; 'down': came back to it or under; null: stayed on its side. */
export type LimitCrossing = 'up' | 'down' | null;

/** A function as one snapshot has it. */
export interface FunctionSide {
  id: string;
  file: string;
  qualifiedName: string;
  line: number;
  cyclomatic: number;
  cyclomaticStrict: number;
  decisions: number;
}

/** One function across the two snapshots. */
export interface FunctionShift {
  status: FunctionShiftStatus;
  /** Null for an added function. */
  before: FunctionSide | null;
  /** Null for a removed function. */
  after: FunctionSide | null;
  /** ΔV(G) as reported (an absent side counts 0). */
  deltaCyclomatic: number;
  deltaDecisions: number;
  crossed: LimitCrossing;
}

/** Sums over the functions of one module (or the codebase) in one snapshot. */
export interface ShiftFigures {
  functions: number;
  cyclomatic: number;
  cyclomaticStrict: number;
  decisions: number;
  /** Functions over the after snapshot's limit. */
  overLimit: number;
  maxCyclomatic: number;
}

/** One module (file or folder) across the two snapshots. */
export interface ModuleShift {
  level: 'file' | 'folder';
  /** `<level>:<path>`, as in the module map. */
  id: string;
  path: string;
  /** Zeros where the module does not exist on that side. */
  before: ShiftFigures;
  after: ShiftFigures;
  /** ΔP */
  deltaFunctions: number;
  /** ΔΣV as reported */
  deltaCyclomatic: number;
  deltaDecisions: number;
  /** Whether its largest V(G) crossed the limit. */
  crossed: LimitCrossing;
}

/** The codebase's ΔΣV, taken apart. */
export interface ShiftTotals {
  before: ShiftFigures;
  after: ShiftFigures;
  deltaFunctions: number;
  deltaCyclomatic: number;
  deltaCyclomaticStrict: number;
  deltaDecisions: number;
  /** Δ Σ decisions by where it came from: functions on both sides, added ones, removed ones (negative). */
  decisionsFrom: { kept: number; added: number; removed: number };
  /** ΔΣV(strict) − (ΔΣ decisions + ΔP): 0 whenever every function has V = decisions + 1. */
  unexplained: number;
  /** Δ(ΣV strict − ΣV reported): what `--switch one` takes off, outside the identity. */
  reportingDelta: number;
}

/** The shift from one snapshot to another. */
export interface Shift {
  /** The after snapshot's limit, used for both sides. */
  limit: number;
  /** The folder depth the folder-level modules were formed with. */
  folderDepth: number;
  functions: FunctionShift[];
  modules: ModuleShift[];
  totals: ShiftTotals;
  counts: Record<FunctionShiftStatus, number>;
  /** Functions and modules whose crossed is not null. */
  crossed: { functions: FunctionShift[]; modules: ModuleShift[] };
}
