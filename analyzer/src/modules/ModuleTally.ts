import { integrationComplexity } from '../design/integrationComplexity';
import type { FunctionRecord, ModuleLevel, ModuleRecord } from '../model';
import { ModuleMapError } from './ModuleMapError';

/** Calls a function makes that the call graph could not resolve, or that go into external packages. */
export interface OpenCalls {
  unresolvedCalls: number;
  externalCalls: number;
}

/** The running sums of one module while the map is built; `toRecord` checks and freezes them. */
export class ModuleTally {
  private functions = 0;
  private cyclomatic = 0;
  private strict = 0;
  private decisions = 0;
  private nodes = 0;
  private edges = 0;
  private maxCyclomatic = 0;
  private overLimit = 0;
  private lines = 0;
  private design = 0;
  private unresolvedCalls = 0;
  private externalCalls = 0;
  private abstractTypes = 0;
  private allTypes = 0;
  fanIn = 0;
  fanOut = 0;
  /** Other modules of the level that depend on this one (Ca) / that this one depends on (Ce). */
  readonly dependents = new Set<string>();
  readonly dependencies = new Set<string>();

  constructor(
    readonly level: ModuleLevel,
    readonly path: string,
    private readonly name?: string,
  ) {}

  get id(): string {
    return `${this.level}:${this.path}`;
  }

  addFunction(f: FunctionRecord, limit: number, open: OpenCalls): void {
    if (f.designComplexity === undefined) {
      throw new ModuleMapError(`function ${f.qualifiedName} (${f.file}, id ${f.id}) has no designComplexity; compute iv(G) before the module map`);
    }
    this.functions++;
    this.cyclomatic += f.cyclomatic;
    this.strict += f.cyclomaticStrict;
    this.decisions += f.decisions;
    this.nodes += f.nodes;
    this.edges += f.edges;
    this.maxCyclomatic = Math.max(this.maxCyclomatic, f.cyclomatic);
    if (f.cyclomatic > limit) this.overLimit++;
    this.design += f.designComplexity;
    this.unresolvedCalls += open.unresolvedCalls;
    this.externalCalls += open.externalCalls;
  }

  addFile(lines: number, types: { abstract: number; total: number } | undefined): void {
    this.lines += lines;
    if (types) {
      this.abstractTypes += types.abstract;
      this.allTypes += types.total;
    }
  }

  toRecord(): ModuleRecord {
    // McCabe 1976: v of a union of P graphs is E − N + 2P; any difference is a bug upstream.
    if (this.strict !== this.edges - this.nodes + 2 * this.functions) {
      throw new ModuleMapError(
        `${this.id}: ΣV(strict) = ${this.strict} but E − N + 2P = ${this.edges} − ${this.nodes} + 2 × ${this.functions} = ${this.edges - this.nodes + 2 * this.functions}`,
      );
    }
    const ca = this.dependents.size;
    const ce = this.dependencies.size;
    const record: ModuleRecord = {
      id: this.id,
      path: this.path,
      level: this.level,
      functions: this.functions,
      cyclomatic: this.cyclomatic,
      decisions: this.decisions,
      nodes: this.nodes,
      edges: this.edges,
      maxCyclomatic: this.maxCyclomatic,
      overLimit: this.overLimit,
      lines: this.lines,
      fanIn: this.fanIn,
      fanOut: this.fanOut,
      ca,
      ce,
      // Martin 2002: I = Ce / (Ca + Ce); 0/0 (an isolated module) has no instability: null.
      instability: ca + ce === 0 ? null : ce / (ca + ce),
      abstractness: this.allTypes === 0 ? null : this.abstractTypes / this.allTypes,
      designComplexity: this.design,
      integrationComplexity: integrationComplexity(this.design, this.functions),
      unresolvedCalls: this.unresolvedCalls,
      externalCalls: this.externalCalls,
      cluster: null,
      gravity: 0,
      gravityRank: 0,
      reasons: [],
    };
    if (this.name !== undefined) record.name = this.name;
    return record;
  }
}
