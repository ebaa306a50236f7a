/**
 * Compound conditions
 * ===================
 * Marks the blocks whose two outcomes are one part of a larger condition, so the ev(G)
 * reduction may join them with the decision they lead to:
 * - short-circuit operators (`&&`, `||`, `??`, `?.`): their left operand is tested first and
 *   one outcome skips the rest of the condition;
 * - `case` labels that share one body with the next label of the same switch
 *   (`case 1: case 2: body`), which is `x === 1 || x === 2` written as labels. Empty blocks
 *   (no span, one way out) between a label and the body are looked through.
 * A case body that has statements and falls through into the next body is not marked: it
 * jumps into another branch of the selection.
 *
 * [Reference]: A. H. Watson & T. J. McCabe, NIST SP 500-235 (1996), §4 (a compound predicate is
 * one condition of the structure, counted per condition for v) and §10.2.
 */
import type { DecisionKind, FlowGraph } from '../model';

const SHORT_CIRCUIT: ReadonlySet<DecisionKind> = new Set<DecisionKind>(['and', 'or', 'nullish', 'optional-chain']);

/** 1 for each block whose outcomes belong to a compound condition, else 0. */
export function compoundConditionBlocks(graph: FlowGraph): Uint8Array {
  const n = graph.blocks.length;
  const marked = new Uint8Array(n);
  const outCount = new Int32Array(n);
  const onlyNext = new Int32Array(n).fill(-1);
  const trueTarget = new Map<number, number>();
  const falseTarget = new Map<number, number>();
  for (const e of graph.edges) {
    outCount[e.from]++;
    onlyNext[e.from] = e.to;
    if (e.decision !== undefined) (e.outcome === 'true' ? trueTarget : falseTarget).set(e.decision, e.to);
  }
  const body = (start: number | undefined): number | undefined => {
    let b = start;
    for (let steps = 0; b !== undefined && steps < n; steps++) {
      const block = graph.blocks[b];
      if (block?.kind !== 'code' || block.span || outCount[b] !== 1) return b;
      b = onlyNext[b];
    }
    return b;
  };
  const caseAt = new Map<number, { id: number; switchIndex?: number }>();
  for (const d of graph.decisions) if (d.kind === 'case') caseAt.set(d.block, d);
  for (const d of graph.decisions) {
    if (!(d.block >= 0 && d.block < n)) continue;
    if (SHORT_CIRCUIT.has(d.kind)) marked[d.block] = 1;
    if (d.kind !== 'case') continue;
    const next = caseAt.get(falseTarget.get(d.id) ?? -1);
    if (next && next.switchIndex === d.switchIndex && body(trueTarget.get(next.id)) === body(trueTarget.get(d.id))) {
      marked[d.block] = 1;
    }
  }
  return marked;
}
