import * as fs from 'node:fs';
import * as path from 'node:path';
import { parseSnapshot, scanDirectory, ScanInputError, SnapshotInputError, type Snapshot as AnalyzedSnapshot } from '../analyzer-lib';
import { UploadRefusedError } from '../uploads/upload-errors';
import { extractZip } from '../uploads/extract-zip';
import { AnalysisFailedError, type AnalysisProgress, type AnalysisRequest } from './analysis-request';

/** Share of the job's percent each phase takes (storing takes the rest, up to 100). */
const ANALYSE_FROM = 5;
const ANALYSE_TO = 85;
const CALLS_AT = 86;

/**
 * Turns an uploaded zip (extract, then scan with the snapshot's counting settings) or a pushed
 * snapshot file (read and validate) into an analysed snapshot. Bad input becomes an
 * AnalysisFailedError of kind `input` with a message for the person who sent it.
 */
export async function analyseInput(request: AnalysisRequest, onProgress: (p: AnalysisProgress) => void): Promise<AnalyzedSnapshot> {
  try {
    if (request.source === 'push') {
      onProgress({ phase: 'read', percent: 10 });
      return parseSnapshot(await fs.promises.readFile(request.inputFile, 'utf8'), 'the pushed snapshot');
    }
    onProgress({ phase: 'extract', percent: 1 });
    const summary = await extractZip(request.inputFile, request.workDir, request.uploadLimits);
    // A zip of one folder scans that folder, so the snapshot's root is the codebase's own name.
    const root = summary.topFolder ? path.join(request.workDir, summary.topFolder) : request.workDir;
    // The server keeps uploaded code: each function's text goes with it, so Flow can show it.
    const snapshot = await scanDirectory(root, { settings: request.settings, embedSource: true }, (p) => {
      if (p.phase === 'discover') onProgress({ phase: 'discover', percent: ANALYSE_FROM });
      else if (p.phase === 'analyse') onProgress({ phase: 'analyse', percent: Math.floor(ANALYSE_FROM + ((ANALYSE_TO - ANALYSE_FROM) * p.done) / Math.max(1, p.total)) });
      else onProgress({ phase: 'calls', percent: CALLS_AT });
    });
    if (snapshot.functions.length === 0) {
      throw new AnalysisFailedError({ kind: 'input', message: noFunctionsMessage(snapshot.files.skipped.length) });
    }
    return snapshot;
  } catch (err) {
    if (err instanceof AnalysisFailedError) throw err;
    if (err instanceof UploadRefusedError || err instanceof ScanInputError || err instanceof SnapshotInputError) {
      throw new AnalysisFailedError({ kind: 'input', message: err.message });
    }
    throw new AnalysisFailedError({ kind: 'crash', message: err instanceof Error ? err.message : String(err) });
  } finally {
    await fs.promises.rm(request.workDir, { recursive: true, force: true });
  }
}

function noFunctionsMessage(skipped: number): string {
  return skipped > 0
    ? `The zip holds no TypeScript or JavaScript that could be analysed (${skipped} file(s) skipped; see the snapshot's skipped files).`
    : 'The zip holds no TypeScript or JavaScript source files (.ts, .tsx, .js, .jsx, .mts, .cts, .mjs, .cjs).';
}
