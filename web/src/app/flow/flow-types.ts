import type { DecisionKind, Outcome } from '../../../../analyzer/src/model/FlowGraph';
import type { CompactGraph, FunctionKind } from '../../../../analyzer/src/model/FunctionRecord';

export type { CompactGraph, DecisionKind, Outcome };

/** One decision of a compact graph (its index in `graph.decisions` is its id). */
export type CompactDecision = CompactGraph['decisions'][number];

/** V(G) band names of the published 1–10 / 11–20 / 21–50 / >50 split. */
export type SeverityBand = 'calm' | 'busy' | 'tangled' | 'knotted';

/** A function's row as the functions table of the API stores it. */
export interface FunctionRow {
  id: string;
  name: string;
  qualifiedName: string;
  kind: FunctionKind;
  file: string;
  folder: string | null;
  package: string | null;
  cluster: string | null;
  /** 1-based first and last line in the file. */
  line: number;
  endLine: number;
  loc: number;
  cyclomatic: number;
  cyclomaticStrict: number;
  decisions: number;
  nodes: number;
  edges: number;
  essential: number;
  designComplexity: number | null;
  band: SeverityBand;
  overLimit: boolean;
  outcomesCovered: number | null;
  outcomesTotal: number | null;
  actualComplexity: number | null;
  untestedPaths: number | null;
  crap: number | null;
}

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
