/**
 * What a report says about one unit
 * =================================
 * The branch records and line hits of a file, narrowed to one function unit: its lines minus
 * the lines strictly inside the units nested in it (their records are theirs). Lines shared
 * with a nested unit (its first and last line) stay, since the outer unit's code may sit
 * there too. Also answers the questions the outcome rules ask of the graph: how often a
 * block's first line ran, and what the first line with a known count is when control flows
 * on from a block.
 */
import type { FlowGraph, SourceSpan } from '../model';
import type { BranchRecord, FileCoverage } from './CoverageReport';

/** A line range of a unit (1-based, inclusive). */
export interface LineRange {
  line: number;
  endLine: number;
}

/** The first line with a known count reached from a block, or `exit` when control runs off the function first. */
export type Reach = { line: number; hits: number } | 'exit' | undefined;

/** The report's records of one unit, with graph walks over its line hits. */
export class UnitHits {
  /** Branch records of the unit, in report order. */
  readonly branches: BranchRecord[];
  private readonly lines = new Map<number, number>();
  private readonly outEdges: number[][];
  private readonly inEdges: number[][];
  private readonly targets = new Map<string, number>();

  constructor(
    readonly graph: FlowGraph,
    file: FileCoverage,
    readonly range: LineRange,
    nested: readonly LineRange[] = [],
  ) {
    const own = (line: number) =>
      line >= range.line && line <= range.endLine && !nested.some((n) => line > n.line && line < n.endLine);
    this.branches = file.branches.filter((b) => own(b.line));
    for (const [line, hits] of file.lines) if (own(line)) this.lines.set(line, hits);
    this.outEdges = graph.blocks.map(() => []);
    this.inEdges = graph.blocks.map(() => []);
    graph.edges.forEach((e, i) => {
      this.outEdges[e.from]?.push(i);
      this.inEdges[e.to]?.push(i);
      if (e.decision !== undefined && e.outcome !== undefined) this.targets.set(`${e.decision}:${e.outcome}`, e.to);
    });
  }

  /** Hits of a line of this unit, undefined when the report has no count for it. */
  hitsOn(line: number): number | undefined {
    return this.lines.get(line);
  }

  /** Whether any line of the unit ran. */
  anyLineRan(): boolean {
    for (const hits of this.lines.values()) if (hits > 0) return true;
    return false;
  }

  /** The first line of a span that has a count (a block's entry count, as far as lines can tell), `skipLine` aside. */
  firstHit(span: SourceSpan | undefined, skipLine?: number): { line: number; hits: number } | undefined {
    if (!span) return undefined;
    for (let line = span.line; line <= span.endLine; line++) {
      const hits = line === skipLine ? undefined : this.lines.get(line);
      if (hits !== undefined) return { line, hits };
    }
    return undefined;
  }

  /**
   * Follows control from a block through blocks without counts, as long as the way is unique.
   * `skipLine` (a decision's own line, whose count mixes its outcomes) is not taken as evidence.
   */
  reach(block: number, skipLine?: number): Reach {
    const seen = new Set<number>();
    let at = block;
    while (!seen.has(at)) {
      seen.add(at);
      const hit = this.firstHit(this.graph.blocks[at]?.span, skipLine);
      if (hit) return hit;
      if (at === this.graph.exit) return 'exit';
      const outs = this.outEdges[at] ?? [];
      if (outs.length !== 1) return undefined;
      at = this.graph.edges[outs[0]].to;
    }
    return undefined;
  }

  /** The target block of a decision's outcome. */
  target(decisionId: number, outcome: 'true' | 'false'): number | undefined {
    return this.targets.get(`${decisionId}:${outcome}`);
  }
}
