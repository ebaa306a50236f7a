/**
 * The module map
 * ==============
 * Aggregates function records into modules at three levels and joins the modules by the calls
 * and imports between them:
 * - file: each scanned file (each file has at least its top-level unit);
 * - folder: the first `folderDepth` folders of each file's path (root files: `.`);
 * - package: the innermost package folder holding the file, files in no package going to the
 *   root package `.`; only when at least one package below the root was found, else the level
 *   is left out.
 * Per module: P, ΣV, Σ decisions, Σ N and Σ E (checked: ΣV(strict) = E − N + 2P), the largest
 * V, functions over the limit, lines of code, fan-in/fan-out (call sites across the module's
 * border), Martin's Ca/Ce (distinct other modules of the level, linked by a call or an import),
 * I, A, S0 = Σ iv(G), S1 = S0 − n + 1 and the calls the call graph left open. Cluster and
 * gravity fields are left empty for the clustering pass. Output is sorted (level, then path;
 * edges by level, from, to), so equal input gives equal output.
 *
 * Edge cases: a call whose function id is unknown is a bug upstream and throws; an import of a
 * file without function records (a file the scan skipped) is left out; repeated imports of the
 * same file count once; calls and imports inside one module count nowhere.
 *
 * [Reference]: R. C. Martin, Agile Software Development (2002), Ca, Ce, I, A; T. J. McCabe &
 * C. W. Butler, CACM 32(12), 1989, S0 and S1; McCabe 1976, v = e − n + 2p.
 */
import type { CallEdge, FunctionRecord, ImportEdge, MapSettings, ModuleEdge, ModuleLevel, ModuleRecord } from '../model';
import { fileCodeLines } from './fileCodeLines';
import { ModuleMapError } from './ModuleMapError';
import { checkFolderDepth, folderOf, normalizeFolder, PackageLocator } from './moduleOfFile';
import { ModuleTally, type OpenCalls } from './ModuleTally';

export interface ModuleMapInput {
  /** Every function record of the scan, each with designComplexity (iv) filled. */
  functions: FunctionRecord[];
  /** Function id → function id. */
  calls: CallEdge[];
  /** File → file. */
  imports: ImportEdge[];
  /** The call graph's open calls per function id; the records' own fields when absent. */
  perFunction?: Map<string, OpenCalls>;
  /** Package folders from findPackages (may be empty; `.` names the root package). */
  packages: { path: string; name: string }[];
  /** Per file: interfaces and abstract classes, and all classes and interfaces (countAbstractness). */
  abstractness: Map<string, { abstract: number; total: number }>;
  settings: Pick<MapSettings, 'folderDepth'>;
  /** V(G) above this is over the limit. */
  limit: number;
}

export interface ModuleMap {
  modules: ModuleRecord[];
  moduleEdges: ModuleEdge[];
}

interface Level {
  level: ModuleLevel;
  moduleOf: Map<string, string>;
  nameOf?: Map<string, string>;
}

/** Modules at the file, folder and (when packages exist) package levels, with the edges between them. */
export function buildModuleMap(input: ModuleMapInput): ModuleMap {
  checkFolderDepth(input.settings.folderDepth);
  if (!Number.isFinite(input.limit)) throw new ModuleMapError(`limit must be a number, not ${input.limit}`);
  const byFile = new Map<string, FunctionRecord[]>();
  const fileOfFunction = new Map<string, string>();
  for (const f of input.functions) {
    if (fileOfFunction.has(f.id)) throw new ModuleMapError(`two functions share the id ${f.id}`);
    fileOfFunction.set(f.id, f.file);
    const list = byFile.get(f.file);
    if (list) list.push(f);
    else byFile.set(f.file, [f]);
  }
  const files = [...byFile.keys()];
  const calls = input.calls.map((c) => fileCall(c, fileOfFunction));
  const imports = distinctImports(input.imports, byFile);

  const modules: ModuleRecord[] = [];
  const moduleEdges: ModuleEdge[] = [];
  for (const level of levelsOf(files, input)) {
    const tallies = new Map<string, ModuleTally>();
    const tallyOf = (file: string): ModuleTally => {
      const path = level.moduleOf.get(file)!;
      let tally = tallies.get(path);
      if (!tally) {
        tally = new ModuleTally(level.level, path, level.nameOf?.get(path));
        tallies.set(path, tally);
      }
      return tally;
    };
    for (const [file, units] of byFile) {
      const tally = tallyOf(file);
      tally.addFile(fileCodeLines(units), input.abstractness.get(file));
      for (const f of units) tally.addFunction(f, input.limit, input.perFunction?.get(f.id) ?? f);
    }
    const edges = new Map<string, ModuleEdge>();
    const link = (fromFile: string, toFile: string, count: number, kind: 'calls' | 'imports'): void => {
      const [from, to] = [tallyOf(fromFile), tallyOf(toFile)];
      if (from === to) return;
      from.dependencies.add(to.id);
      to.dependents.add(from.id);
      if (kind === 'calls') {
        from.fanOut += count;
        to.fanIn += count;
      }
      const key = `${from.id}\0${to.id}`;
      let edge = edges.get(key);
      if (!edge) {
        edge = { level: level.level, from: from.id, to: to.id, weight: 0, calls: 0, imports: 0 };
        edges.set(key, edge);
      }
      edge[kind] += count;
      edge.weight += count;
    };
    for (const c of calls) link(c.from, c.to, c.count, 'calls');
    for (const i of imports) link(i.from, i.to, 1, 'imports');
    modules.push(...[...tallies.values()].sort((a, b) => byText(a.path, b.path)).map((t) => t.toRecord()));
    moduleEdges.push(...[...edges.values()].sort((a, b) => byText(a.from, b.from) || byText(a.to, b.to)));
  }
  return { modules, moduleEdges };
}

function levelsOf(files: string[], input: ModuleMapInput): Level[] {
  const nameOf = new Map(input.packages.map((p) => [normalizeFolder(p.path), p.name]));
  const found = [...nameOf.keys()].filter((p) => p !== '.');
  // Without a package below the root the package level would repeat the whole codebase as one module.
  const locator = found.length > 0 ? new PackageLocator(found) : undefined;
  const levels: Level[] = [
    { level: 'file', moduleOf: new Map(files.map((f) => [f, f])) },
    { level: 'folder', moduleOf: new Map(files.map((f) => [f, folderOf(f, input.settings.folderDepth, locator?.packageOf(f))])) },
  ];
  if (locator) levels.push({ level: 'package', moduleOf: new Map(files.map((f) => [f, locator.packageOf(f)])), nameOf });
  return levels;
}

function fileCall(c: CallEdge, fileOfFunction: Map<string, string>): { from: string; to: string; count: number } {
  const from = fileOfFunction.get(c.from);
  const to = fileOfFunction.get(c.to);
  if (from === undefined || to === undefined) {
    throw new ModuleMapError(`call ${c.from} → ${c.to} names a function that is not among the records`);
  }
  if (!Number.isInteger(c.count) || c.count < 0) throw new ModuleMapError(`call ${c.from} → ${c.to} has count ${c.count}`);
  return { from, to, count: c.count };
}

function distinctImports(imports: ImportEdge[], byFile: Map<string, unknown>): ImportEdge[] {
  const seen = new Set<string>();
  const kept: ImportEdge[] = [];
  for (const i of imports) {
    const key = `${i.from}\0${i.to}`;
    if (i.from === i.to || !byFile.has(i.from) || !byFile.has(i.to) || seen.has(key)) continue;
    seen.add(key);
    kept.push(i);
  }
  return kept;
}

// Plain code-unit order: the same on every machine and locale.
function byText(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}
