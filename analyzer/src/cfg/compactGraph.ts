/**
 * Compact flow graph
 * ==================
 * The stored form of a flow graph (FunctionRecord.graph): blocks as `[line, column, endLine,
 * endColumn]` or null, edges as `[from, to]` or `[from, to, decision, 1 | 0]`, decisions without
 * their id (the index is the id). Block kinds are implied: the entry and exit ids, a block some
 * decision names is a decision block, any other is a code block. The round trip is exact for
 * every graph `buildFlowGraph` makes; a graph the compact form cannot express (ids that are not
 * indexes, a decision block no decision names) is refused with a FlowGraphError.
 */
import type { CompactGraph } from '../model/FunctionRecord';
import type { BasicBlock, Decision, FlowEdge, FlowGraph } from '../model/FlowGraph';
import { FlowGraphError } from './FlowGraphError';

/** The compact (stored) form of a flow graph. */
export function toCompactGraph(graph: FlowGraph): CompactGraph {
  const named = new Set<number>();
  graph.decisions.forEach((d, i) => {
    if (d.id !== i) throw new FlowGraphError(`decision ${d.id} is stored at index ${i}`);
    named.add(d.block);
  });
  const blocks = graph.blocks.map((block, i): CompactGraph['blocks'][number] => {
    if (block.id !== i) throw new FlowGraphError(`block ${block.id} is stored at index ${i}`);
    const implied = i === graph.entry ? 'entry' : i === graph.exit ? 'exit' : named.has(i) ? 'decision' : 'code';
    if (block.kind !== implied) throw new FlowGraphError(`block ${i} is '${block.kind}' but its role says '${implied}'`);
    const s = block.span;
    return s ? [s.line, s.column, s.endLine, s.endColumn] : null;
  });
  const edges = graph.edges.map((e): CompactGraph['edges'][number] =>
    e.decision === undefined ? [e.from, e.to] : [e.from, e.to, e.decision, e.outcome === 'true' ? 1 : 0],
  );
  const decisions = graph.decisions.map((d) => {
    const stored: CompactGraph['decisions'][number] = { kind: d.kind, block: d.block, span: { ...d.span }, text: d.text };
    if (d.switchIndex !== undefined) stored.switchIndex = d.switchIndex;
    return stored;
  });
  return { entry: graph.entry, exit: graph.exit, blocks, edges, decisions };
}

/** The flow graph of a compact form (inverse of `toCompactGraph`). */
export function fromCompactGraph(c: CompactGraph): FlowGraph {
  const named = new Set(c.decisions.map((d) => d.block));
  const blocks = c.blocks.map((s, id): BasicBlock => {
    const kind = id === c.entry ? 'entry' : id === c.exit ? 'exit' : named.has(id) ? 'decision' : 'code';
    const block: BasicBlock = { id, kind };
    if (s) block.span = { line: s[0], column: s[1], endLine: s[2], endColumn: s[3] };
    return block;
  });
  const edges = c.edges.map((e): FlowEdge => {
    if (e.length === 2) return { from: e[0], to: e[1] };
    return { from: e[0], to: e[1], decision: e[2], outcome: e[3] === 1 ? 'true' : 'false' };
  });
  const decisions = c.decisions.map((d, id): Decision => {
    const decision: Decision = { id, kind: d.kind, block: d.block, span: { ...d.span }, text: d.text };
    if (d.switchIndex !== undefined) decision.switchIndex = d.switchIndex;
    return decision;
  });
  return { blocks, edges, decisions, entry: c.entry, exit: c.exit };
}
