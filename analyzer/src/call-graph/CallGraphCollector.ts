/**
 * Collecting the call graph
 * =========================
 * Takes each file's calls once the file has been walked without error and merges them: call
 * edges per (from, to, kind, certain) with the number of call sites, import edges without
 * duplicates, per-function counts of unresolved and external calls with every call site, and
 * external calls per package. Dispatch through interfaces and abstract members is held back
 * until every class is known, then becomes one uncertain edge per implementation.
 *
 * [Reference]: the model's CallEdge / ImportEdge / ExternalPackageCalls (model/ModuleMap.ts).
 */
import type { CallEdge, CallKind, ExternalPackageCalls, ImportEdge } from '../model';
import type { CallResolver, CallTarget } from './CallResolver';
import type { CallSite, FileCalls, SiteFact } from './collectFileCalls';
import type { DispatchIndex } from './DispatchIndex';

/** Per function (by caller id): calls that reach nothing known, calls into external code, and every call site. */
export interface FunctionCalls {
  unresolvedCalls: number;
  externalCalls: number;
  callSites: CallSite[];
}

export class CallGraphCollector {
  private readonly edges = new Map<string, CallEdge>();
  private readonly imports = new Map<string, ImportEdge>();
  private readonly externals = new Map<string, number>();
  readonly perFunction = new Map<string, FunctionCalls>();
  private readonly pending: { file: string; fact: SiteFact & { target: { kind: 'dispatch' } } }[] = [];

  /** Adds a walked file: `unitIds` are all its units, `calls` what the walk found. */
  addFile(file: string, unitIds: string[], calls: FileCalls): void {
    for (const id of unitIds) this.perFunction.set(id, { unresolvedCalls: 0, externalCalls: 0, callSites: [] });
    for (const fact of calls.sites) {
      this.perFunction.get(fact.from)!.callSites.push(fact.site);
      if (fact.target.kind === 'dispatch') this.pending.push({ file, fact: fact as SiteFact & { target: { kind: 'dispatch' } } });
      else this.apply(fact, fact.target, true);
    }
    for (const reference of calls.references) this.addEdge(reference.from, reference.to, 'reference', true);
    for (const to of calls.imports) this.imports.set(`${file}\0${to}`, { from: file, to });
  }

  /** Turns held-back dispatch into edges; returns the files where that failed, with why. */
  resolveDispatch(index: DispatchIndex, resolver: CallResolver): { file: string; detail: string }[] {
    const failed = new Map<string, string>();
    for (const { file, fact } of this.pending) {
      let target: CallTarget;
      try {
        const ids = index.implementations(fact.target.member);
        target = ids.length > 0 ? { kind: 'units', ids } : resolver.withoutImplementations(fact.target.member);
      } catch (err) {
        if (!failed.has(file)) failed.set(file, `analyzer/call-graph: dispatch through an interface failed: ${messageOf(err)}`);
        target = { kind: 'unresolved' };
      }
      this.apply(fact, target, false);
    }
    this.pending.length = 0;
    return [...failed].map(([file, detail]) => ({ file, detail }));
  }

  /** The merged edges (sorted), imports (sorted) and external packages (most calls first). */
  result(): { calls: CallEdge[]; imports: ImportEdge[]; externals: ExternalPackageCalls[] } {
    const calls = [...this.edges.values()].sort((a, b) => compare(a.from, b.from) || compare(a.to, b.to) || compare(a.kind, b.kind) || Number(b.certain) - Number(a.certain));
    const imports = [...this.imports.values()].sort((a, b) => compare(a.from, b.from) || compare(a.to, b.to));
    const externals = [...this.externals].map(([name, count]) => ({ package: name, calls: count })).sort((a, b) => b.calls - a.calls || compare(a.package, b.package));
    return { calls, imports, externals };
  }

  private apply(fact: SiteFact, target: CallTarget, certain: boolean): void {
    const facts = this.perFunction.get(fact.from)!;
    switch (target.kind) {
      case 'units':
        fact.site.to = target.ids;
        for (const to of target.ids) this.addEdge(fact.from, to, fact.kind, certain);
        break;
      case 'external':
        facts.externalCalls++;
        this.externals.set(target.group, (this.externals.get(target.group) ?? 0) + 1);
        break;
      case 'unresolved':
        facts.unresolvedCalls++;
        break;
      default:
        // 'internal': resolved into the scanned code, but no unit runs (a class without a constructor).
        break;
    }
  }

  private addEdge(from: string, to: string, kind: CallKind, certain: boolean): void {
    const key = `${from}\0${to}\0${kind}\0${certain ? 1 : 0}`;
    const edge = this.edges.get(key);
    if (edge) edge.count++;
    else this.edges.set(key, { from, to, count: 1, kind, certain });
  }
}

function compare(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

/** The message of whatever was thrown. */
export function messageOf(err: unknown): string {
  return err instanceof Error ? `${err.name}: ${err.message}` : String(err);
}
