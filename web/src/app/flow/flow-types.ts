import type { DecisionKind, Outcome } from '../../../../analyzer/src/model/FlowGraph';
import type { CompactGraph } from '../../../../analyzer/src/model/FunctionRecord';
import type { FunctionRow } from '../functions/functions-types';

export type { CompactGraph, DecisionKind, Outcome };

/** One decision of a compact graph (its index in `graph.decisions` is its id). */
export type CompactDecision = CompactGraph['decisions'][number];

/** The function's row is the one the Functions table lists (same API columns). */
export type { FunctionRow, SeverityBand } from '../functions/functions-types';

/** V(G) worked out both ways, with this function's numbers. */
export interface CyclomaticFormula {
  edges: number;
  nodes: number;
  components: number;
  /** E − N + 2P of the graph. */
  strict: number;
  /** Decisions counted on the syntax tree. */
  decisions: number;
  /** V(G) as reported under the snapshot's counting settings. */
  reported: number;
  text: string;
}

/** One basis path: a test case. */
export interface BasisPath {
  /** 0-based; path 0 is the baseline. */
  index: number;
  blocks: number[];
  /** Indexes into `graph.edges`. */
  edges: number[];
  steps: { decision: number; outcome: Outcome }[];
  /** One readable line per decision outcome the path takes. */
  description: string[];
}

/** Decisions and outcomes no entry-to-exit path can take. */
export interface BasisGap {
  exitReachable: boolean;
  unreachableDecisions: number[];
  trappedDecisions: number[];
  trappedOutcomes: { decision: number; outcome: Outcome }[];
}

/** Coverage mapped onto the function's decisions. */
export interface FunctionCoverageDetail {
  /** Per decision: [true covered, false covered]. */
  outcomes: [boolean, boolean][];
  outcomesCovered: number;
  outcomesTotal: number;
  /** AC: cyclomatic number of the covered edges. */
  actualComplexity: number;
  /** V − AC. */
  untestedPaths: number;
  crap: number;
}

/** `GET /api/snapshots/:id/functions/:functionId`. */
export interface FunctionDetail {
  function: FunctionRow;
  graph: CompactGraph;
  formula: CyclomaticFormula;
  essential: { value: number; irreducibleDecisions: number[] };
  basisPaths: BasisPath[];
  gaps: BasisGap;
  coverage: FunctionCoverageDetail | null;
  /** The function's text from its first character (on `function.line`), or null when not kept. */
  source: string | null;
  /** The snapshot's V(G) limit. */
  limit: number;
}
