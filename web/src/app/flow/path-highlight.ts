import type { BasisPath, CompactGraph, FunctionCoverageDetail, Outcome } from './flow-types';

/** What a selected basis path marks on the graph and in the source. */
export interface PathHighlight {
  blocks: ReadonlySet<number>;
  edges: ReadonlySet<number>;
  /** The outcomes the path takes at each decision it passes (a loop test may take both). */
  outcomes: ReadonlyMap<number, ReadonlySet<Outcome>>;
  /** 1-based file lines of the blocks on the path. */
  lines: ReadonlySet<number>;
}

/** Nothing highlighted. */
export const NO_HIGHLIGHT: PathHighlight = { blocks: new Set(), edges: new Set(), outcomes: new Map(), lines: new Set() };

/** The blocks, edges, decision outcomes and source lines of one basis path. */
export function pathHighlight(graph: CompactGraph, path: BasisPath | null): PathHighlight {
  if (!path) return NO_HIGHLIGHT;
  const outcomes = new Map<number, Set<Outcome>>();
  for (const step of path.steps) {
    const taken = outcomes.get(step.decision) ?? new Set<Outcome>();
    taken.add(step.outcome);
    outcomes.set(step.decision, taken);
  }
  const lines = new Set<number>();
  for (const block of path.blocks) {
    const span = graph.blocks[block];
    if (!span) continue;
    for (let line = span[0]; line <= span[2]; line++) lines.add(line);
  }
  return { blocks: new Set(path.blocks), edges: new Set(path.edges), outcomes, lines };
}

/** Whether the report covered each edge's outcome: null for edges that are no decision outcome. */
export function edgeCoverage(graph: CompactGraph, coverage: FunctionCoverageDetail | null): (boolean | null)[] {
  return graph.edges.map((edge) => {
    if (!coverage || edge.length !== 4) return null;
    const both = coverage.outcomes[edge[2]];
    if (!both) return null;
    return edge[3] === 1 ? both[0] : both[1];
  });
}

/** How many of the distinct outcomes a path needs the coverage report counted. */
export function pathOutcomesCovered(
  path: BasisPath,
  coverage: FunctionCoverageDetail,
): { covered: number; total: number } {
  const needed = new Set(path.steps.map((s) => `${s.decision}:${s.outcome}`));
  let covered = 0;
  for (const key of needed) {
    const [decision, outcome] = key.split(':');
    const both = coverage.outcomes[Number(decision)];
    if (both && (outcome === 'true' ? both[0] : both[1])) covered++;
  }
  return { covered, total: needed.size };
}
