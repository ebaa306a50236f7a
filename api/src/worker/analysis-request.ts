import type { CountingSettings } from '../analyzer-lib';
import type { UploadLimits } from '../uploads/upload-limits';

/** What one analysis needs, plain data so it can cross into the analysis thread. */
export interface AnalysisRequest {
  snapshotId: string;
  source: 'upload' | 'push';
  /** The uploaded zip or the pushed snapshot file. */
  inputFile: string;
  /** A fresh folder the zip is extracted into (removed afterwards). */
  workDir: string;
  settings: CountingSettings;
  uploadLimits: UploadLimits;
}

/** How far an analysis is: a phase and the percent of the whole job. */
export interface AnalysisProgress {
  phase: 'extract' | 'discover' | 'analyse' | 'calls' | 'read' | 'store';
  percent: number;
}

/**
 * Why an analysis ended without a snapshot. `input`: the code or file cannot be analysed, a retry
 * would fail the same way; `limit`: it went over its time or memory; `crash`: anything else,
 * worth a retry.
 */
export interface AnalysisFailure {
  kind: 'input' | 'limit' | 'crash';
  message: string;
}

export class AnalysisFailedError extends Error {
  constructor(readonly failure: AnalysisFailure) {
    super(failure.message);
    this.name = 'AnalysisFailedError';
  }
}
