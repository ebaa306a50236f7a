import type { Snapshot } from '../model/Snapshot';
import { countOf, formatCount } from './formatCount';

/**
 * The line a scan ends with on stderr:
 * `scanned 812 files (3 skipped) · 4,120 functions · ΣV 11,208 · 7,088 decisions · 37 over the limit of 10 (rule of thumb, not a verdict)`.
 */
export function formatSummary(snapshot: Snapshot): string {
  const { totals, files, settings } = snapshot;
  const skipped = files.skipped.length > 0 ? ` (${formatCount(files.skipped.length)} skipped)` : '';
  return [
    `scanned ${countOf(files.scanned, 'file')}${skipped}`,
    countOf(totals.functions, 'function'),
    `ΣV ${formatCount(totals.cyclomatic)}`,
    countOf(totals.decisions, 'decision'),
    `${formatCount(totals.overLimit)} over the limit of ${formatCount(settings.limit)} (rule of thumb, not a verdict)`,
  ].join(' · ');
}
