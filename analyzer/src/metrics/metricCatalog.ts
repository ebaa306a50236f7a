/**
 * Every metric Seamline reports, per function or per module, with the snapshot fields it fills
 * and the page in docs/metrics/ that defines it with a worked example. A test checks that each
 * metric has its page and that every numeric field of a function record belongs to a metric.
 */
export interface MetricEntry {
  /** Also the name of its page: docs/metrics/<id>.md. */
  id: string;
  title: string;
  /** Fields of FunctionRecord (or of its coverage, prefixed `coverage.`) or of ModuleRecord it fills. */
  fields: string[];
}

export const METRIC_CATALOG: readonly MetricEntry[] = [
  { id: 'cyclomatic', title: 'Cyclomatic complexity V(G)', fields: ['cyclomatic', 'cyclomaticStrict', 'nodes', 'edges'] },
  { id: 'decisions', title: 'Decisions π', fields: ['decisions'] },
  { id: 'essential', title: 'Essential complexity ev(G)', fields: ['essential'] },
  { id: 'basis-paths', title: 'Basis paths (baseline method)', fields: [] },
  { id: 'loc', title: 'Lines of code', fields: ['loc'] },
  { id: 'coverage', title: 'Covered outcomes, actual complexity AC and untested paths', fields: ['coverage.outcomesCovered', 'coverage.outcomesTotal', 'coverage.actualComplexity', 'coverage.untestedPaths'] },
  { id: 'crap', title: 'CRAP', fields: ['coverage.crap'] },
  { id: 'modules', title: 'Module map: modules, coupling and instability', fields: [] },
  { id: 'design', title: 'Design complexity iv(G), S0 and S1', fields: ['designComplexity'] },
  { id: 'carve', title: 'Carve plan: cut, chatter, cohesion and S1 of a split', fields: [] },
  { id: 'shift', title: 'Shift: what changed between two snapshots', fields: [] },
  { id: 'clusters', title: 'Clusters and modularity Q', fields: [] },
  { id: 'gravity', title: 'Gravity', fields: ['gravity', 'gravityRank'] },
];
