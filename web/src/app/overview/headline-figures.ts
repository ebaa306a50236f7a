import type { Codebase, Snapshot } from '../api-types';

/** The limit V(G) is compared with when a snapshot does not say (the published rule of thumb). */
export const DEFAULT_LIMIT = 10;

/** A ready snapshot's figures as the Overview shows them. */
export interface HeadlineFigures {
  /** P: functions, each its own connected component of the control-flow graphs. */
  functions: number;
  /** ΣV(G) over all functions. */
  cyclomatic: number;
  /** Σπ: decisions over all functions, counted on the syntax tree. */
  decisions: number;
  /** ΣV − Σπ, which equals P when V(G) is counted per case (each function adds one). */
  difference: number;
  /** Whether ΣV − Σπ = P holds for these counting settings. */
  differenceIsP: boolean;
  /** Functions whose V(G) is above the limit, or null when the analysis did not say. */
  overLimit: number | null;
  /** The limit the snapshot was counted with. */
  limit: number;
  /** Modularity Q of the module clusters, or null without a module map. */
  modularity: number | null;
  /** Whether switches were counted as one decision (then ΣV − Σπ is less than P). */
  switchCountedAsOne: boolean;
}

/** The newest snapshot of the codebase whose analysis is ready, or null. */
export function latestReady(codebase: Codebase): Snapshot | null {
  return codebase.snapshots.find((snapshot) => snapshot.status === 'ready' && snapshot.totals !== null) ?? null;
}

/** The headline figures of a ready snapshot, or null while it has no totals. */
export function headlineFigures(snapshot: Snapshot): HeadlineFigures | null {
  const totals = snapshot.totals;
  if (!totals) return null;
  const difference = totals.cyclomatic - totals.decisions;
  return {
    functions: totals.functions,
    cyclomatic: totals.cyclomatic,
    decisions: totals.decisions,
    difference,
    differenceIsP: difference === totals.functions,
    overLimit: totals.overLimit ?? null,
    limit: snapshot.settings?.limit ?? DEFAULT_LIMIT,
    modularity: typeof totals.modularity === 'number' ? totals.modularity : null,
    switchCountedAsOne: snapshot.settings?.switch === 'one',
  };
}

/** Whether the snapshot's analysis is still to come or under way. */
export function isUnfinished(snapshot: Snapshot): boolean {
  return snapshot.status === 'queued' || snapshot.status === 'running';
}

/** What the analysis is doing, in words, for a phase the worker reports. */
export function phaseLabel(phase: string | null | undefined): string {
  switch (phase) {
    case 'queued':
      return 'Waiting for a worker';
    case 'retrying':
      return 'Waiting to try again';
    case 'start':
      return 'Starting';
    case 'read':
      return 'Reading the snapshot file';
    case 'extract':
      return 'Unpacking the zip';
    case 'discover':
      return 'Finding the source files';
    case 'analyse':
      return 'Measuring each function';
    case 'calls':
      return 'Resolving calls and the module map';
    case 'store':
      return 'Storing the results';
    default:
      return phase ? phase : 'Working';
  }
}

/** A file size for people: bytes, KB or MB (1 KB = 1,024 bytes). */
export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes.toLocaleString('en-US')} ${bytes === 1 ? 'byte' : 'bytes'}`;
  if (bytes < 1024 * 1024) return `${Math.round(bytes / 1024).toLocaleString('en-US')} KB`;
  return `${(bytes / (1024 * 1024)).toLocaleString('en-US', { maximumFractionDigits: 1 })} MB`;
}
