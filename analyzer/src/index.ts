// Public surface of the analyzer library. The core is pure (text in, plain data out); the
// project/ door reads files, and cli/ is the thin command-line shell around both.
export * from './model';
export { SEVERITY_BANDS, severityBand } from './bands/severityBand';
export type { SeverityBand } from './bands/severityBand';
export { analyzeSource, MetricMismatchError, SourceSyntaxError } from './analyzeSource';
export type { AnalyzeOptions, SourceAnalysis } from './analyzeSource';
export { buildFlowGraph } from './cfg/buildFlowGraph';
export { fromCompactGraph, toCompactGraph } from './cfg/compactGraph';
export { countDecisions } from './decisions/countDecisions';
export { cyclomaticOf, reportedCyclomatic } from './metrics/cyclomatic';
export { computeTotals } from './metrics/computeTotals';
export { METRIC_CATALOG } from './metrics/metricCatalog';
export { essentialComplexity } from './essential/essentialComplexity';
export { basisPaths } from './paths/basisPaths';
export { basisCoverageGap } from './paths/basisCoverageGap';
export { describePath } from './paths/describePath';
export { pathRank } from './paths/pathRank';
export { crap } from './coverage/crap';
export { importCoverage } from './coverage/importCoverage';
export { parseCoverageReport } from './coverage/parseCoverageReport';
export { parseSnapshot } from './snapshot/parseSnapshot';
export { snapshotSchemaProblems } from './snapshot/validateSnapshot';
export { SnapshotInputError } from './snapshot/SnapshotInputError';
export { findBreaches } from './check/findBreaches';
export { toSarif } from './formats/toSarif';
export { functionsCsv } from './formats/functionsCsv';
export { scanDirectory, ScanInputError } from './project/scanDirectory';
export type { ScanOptions, ScanProgress } from './project/scanDirectory';
