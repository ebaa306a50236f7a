/**
 * The module map of a scanned codebase
 * ====================================
 * After every file's functions are measured: resolves the call graph with the type checker,
 * gives each function its design complexity iv(G), aggregates modules at the file, folder and
 * package levels, clusters each level with Louvain and ranks gravity. Everything here is
 * computed from the scan's records plus one TypeScript program of the scanned files.
 */
import type { CallGraphResult } from '../call-graph/buildCallGraph';
import { callGraphOfProgram } from '../call-graph/callGraphOfProgram';
import { fromCompactGraph } from '../cfg/compactGraph';
import { clusterLevel, indexModuleLevel } from '../clusters/clusterModules';
import { callBlocksOf, designComplexity } from '../design/designComplexity';
import { rankLevelGravity } from '../gravity/rankGravity';
import type { ClusterRecord, CountingSettings, FunctionRecord, MapSettings, ModuleLevel, ModuleRecord, Snapshot } from '../model';
import { buildModuleMap } from '../modules/buildModuleMap';
import { countAbstractness } from '../modules/countAbstractness';
import { createProgram } from './createProgram';
import { findPackages } from './findPackages';
import * as path from 'node:path';

export interface MapInput {
  root: string;
  /** The files whose functions were measured. */
  files: string[];
  tsconfig?: string;
  settings: CountingSettings;
  mapSettings: MapSettings;
}

const LEVELS: ModuleLevel[] = ['file', 'folder', 'package'];

/** Adds calls, modules, clusters and gravity to `functions`; returns the snapshot parts they fill. */
export function mapCodebase(input: MapInput, functions: FunctionRecord[]): Pick<Snapshot, 'calls' | 'imports' | 'externals' | 'modules' | 'moduleEdges' | 'clusters' | 'mapSettings'> & {
  functions: FunctionRecord[];
  failedFiles: CallGraphResult['failedFiles'];
  modularity: number;
} {
  // One program serves the call graph and the count of abstract types.
  const { program, unreadable } = createProgram({ root: input.root, files: input.files, tsconfig: input.tsconfig });
  const graph = callGraphOfProgram(program, { root: input.root, files: input.files, settings: input.settings, unreadable });
  const abstractness = new Map<string, { abstract: number; total: number }>();
  for (const file of input.files) {
    const sourceFile = program.getSourceFile(path.join(input.root, file));
    if (sourceFile) abstractness.set(file, countAbstractness(sourceFile));
  }
  const measured = new Set(functions.map((f) => f.id));
  const withDesign = functions.map((f) => {
    const facts = graph.perFunction.get(f.id);
    // Every function is a module in McCabe's design reduction: a call to any other function counts.
    const sites = (facts?.callSites ?? []).filter((s) => s.to.some((to) => to !== f.id && measured.has(to)));
    const flow = fromCompactGraph(f.graph);
    return {
      ...f,
      unresolvedCalls: facts?.unresolvedCalls ?? 0,
      externalCalls: facts?.externalCalls ?? 0,
      designComplexity: designComplexity(flow, callBlocksOf(flow, sites)),
    };
  });
  const { modules, moduleEdges } = buildModuleMap({
    functions: withDesign,
    calls: graph.calls,
    imports: graph.imports,
    perFunction: graph.perFunction,
    packages: findPackages(input.root),
    abstractness,
    settings: input.mapSettings,
    limit: input.settings.limit,
  });

  const clusters: ClusterRecord[] = [];
  const placed: ModuleRecord[] = [];
  let modularity = 0;
  for (const level of LEVELS) {
    const members = modules.filter((m) => m.level === level);
    if (members.length === 0) continue;
    const edges = moduleEdges.filter((e) => e.level === level);
    // One index of the level for both: mapping module ids is the costly part on large maps.
    const indexed = indexModuleLevel(members, edges, level);
    const clustered = clusterLevel(indexed, input.mapSettings);
    if (level === 'file') modularity = clustered.modularity;
    clusters.push(...clustered.clusters);
    const gravity = rankLevelGravity(indexed, clustered.community);
    for (const m of members) {
      const g = gravity.get(m.id);
      placed.push({ ...m, cluster: clustered.assignment.get(m.id) ?? null, gravity: g?.gravity ?? 0, gravityRank: g?.rank ?? 0, reasons: g?.reasons ?? [] });
    }
  }
  return {
    functions: withDesign,
    calls: graph.calls,
    imports: graph.imports,
    externals: graph.externals,
    modules: placed,
    moduleEdges,
    clusters,
    mapSettings: { ...input.mapSettings },
    failedFiles: graph.failedFiles,
    modularity,
  };
}
