import type { Snapshot } from '../model/Snapshot';
import { countOf, formatCount } from './formatCount';

/**
 * The line a scan ends with on stderr (`formatCallSummary` gives the second one):
 * `scanned 812 files (3 skipped) · 4,120 functions · ΣV 11,208 · 7,088 decisions · 37 over the limit of 10 (rule of thumb, not a verdict)`,
 * With the call graph a second line says how many calls were resolved and how many were
 * not — unresolved calls are shown, never silently dropped:
 * `calls: 1,930 sites resolved to 1,452 edges · 231 unresolved · 322 into external code (typescript-lib 322) · 14 modules, 3 clusters (Q 0.38) at folder level`.
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

/** The second summary line, for scans with the call graph; undefined without it. */
export function formatCallSummary(snapshot: Snapshot): string | undefined {
  if (!snapshot.calls) return undefined;
  const calls = snapshot.calls ?? [];
  const sites = calls.reduce((sum, c) => sum + c.count, 0);
  const unresolved = snapshot.functions.reduce((sum, f) => sum + f.unresolvedCalls, 0);
  const external = snapshot.functions.reduce((sum, f) => sum + f.externalCalls, 0);
  const top = (snapshot.externals ?? []).slice(0, 3).map((e) => `${e.package} ${formatCount(e.calls)}`).join(', ');
  const folders = (snapshot.modules ?? []).filter((m) => m.level === 'folder').length;
  const clusters = (snapshot.clusters ?? []).filter((c) => c.level === 'folder').length;
  return [
    `calls: ${countOf(sites, 'site')} resolved to ${countOf(calls.length, 'edge')}`,
    `${formatCount(unresolved)} unresolved`,
    `${formatCount(external)} into external code${top ? ` (${top})` : ''}`,
    `${countOf(folders, 'folder module')}, ${countOf(clusters, 'cluster')} at folder level (file-level Q ${(snapshot.totals.modularity ?? 0).toFixed(2)})`,
  ].join(' · ');
}
