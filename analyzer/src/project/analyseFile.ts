import * as fs from 'node:fs';
import * as path from 'node:path';
import { analyzeSource, SourceSyntaxError } from '../analyzeSource';
import type { CountingSettings, FunctionRecord, SkippedFile } from '../model';
import { classifySource } from './classifySource';

/** Files larger than this are not parsed (they are data or bundles, and would exhaust memory). */
export const MAX_FILE_BYTES = 50 * 1024 * 1024;

export type FileResult = { file: string; functions: FunctionRecord[]; loc: number } | { file: string; skipped: SkippedFile };

export interface FileJob {
  root: string;
  settings: CountingSettings;
  embedSource: boolean;
  /** Files with a longer line are skipped as minified; 0 turns the check off. */
  maxLineLength: number;
}

/**
 * Reads and measures one file. Whatever goes wrong stays with this file: it comes back as
 * skipped with the reason, and the scan goes on with the others.
 */
export function analyseFile(job: FileJob, file: string): FileResult {
  const absolute = path.join(job.root, file);
  try {
    const size = fs.statSync(absolute).size;
    if (size > MAX_FILE_BYTES) return { file, skipped: { file, reason: 'too-large', detail: `${size} bytes` } };
    const text = fs.readFileSync(absolute, 'utf8');
    const skip = classifySource(text, job.maxLineLength);
    if (skip) return { file, skipped: { file, ...skip } };
    return { file, ...analyzeSource(file, text, job.settings, { embedSource: job.embedSource }) };
  } catch (err) {
    if (err instanceof SourceSyntaxError) return { file, skipped: { file, reason: 'syntax-error', detail: err.message } };
    // Deeply nested code can exhaust the stack; a bug of ours must not sink the whole scan either.
    return { file, skipped: { file, reason: 'analysis-failed', detail: (err as Error)?.message ?? String(err) } };
  }
}
