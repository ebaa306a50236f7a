/**
 * Flow graph invariants
 * =====================
 * Lists every way a graph breaks the rules of FlowGraph.ts: ids equal to indexes, exactly one
 * entry and one exit block, the exit without out-edges, each decision block with exactly one
 * `true` and one `false` edge labelled with its own decision, every other block with exactly one
 * unlabelled out-edge, edges naming existing blocks, and every block reaching the exit (dead
 * code may be unreachable from the entry, but it still flows on to the exit).
 * An empty list means the graph is sound; V(G) = decisions + 1 follows for a connected graph.
 */
import type { FlowGraph } from '../model/FlowGraph';

/** Problems found in the graph, one message each (empty when it keeps every invariant). */
export function validateFlowGraph(graph: FlowGraph): string[] {
  const problems: string[] = [];
  const n = graph.blocks.length;
  const exists = (id: number): boolean => Number.isInteger(id) && id >= 0 && id < n;
  graph.blocks.forEach((b, i) => {
    if (b.id !== i) problems.push(`block at index ${i} has id ${b.id}`);
  });
  graph.decisions.forEach((d, i) => {
    if (d.id !== i) problems.push(`decision at index ${i} has id ${d.id}`);
  });
  const count = (kind: string): number => graph.blocks.filter((b) => b.kind === kind).length;
  if (count('entry') !== 1 || graph.blocks[graph.entry]?.kind !== 'entry') problems.push('there must be exactly one entry block');
  if (count('exit') !== 1 || graph.blocks[graph.exit]?.kind !== 'exit') problems.push('there must be exactly one exit block');

  const out: number[][] = graph.blocks.map(() => []);
  const into: number[][] = graph.blocks.map(() => []);
  graph.edges.forEach((e, i) => {
    if (!exists(e.from) || !exists(e.to)) {
      problems.push(`edge ${i} (${e.from} → ${e.to}) names a missing block`);
      return;
    }
    out[e.from].push(i);
    into[e.to].push(e.from);
  });
  const owner = new Map<number, number>();
  for (const d of graph.decisions) {
    if (!exists(d.block) || graph.blocks[d.block].kind !== 'decision') problems.push(`decision ${d.id} names block ${d.block}, not a decision block`);
    if (owner.has(d.block)) problems.push(`block ${d.block} belongs to decisions ${owner.get(d.block)} and ${d.id}`);
    owner.set(d.block, d.id);
  }
  for (const b of graph.blocks) {
    const edges = out[b.id] ?? [];
    if (b.kind === 'exit') {
      if (edges.length !== 0) problems.push(`exit block ${b.id} has ${edges.length} out-edges`);
    } else if (b.kind === 'decision') {
      const d = owner.get(b.id);
      const labels = edges.map((i) => graph.edges[i]);
      const ok = labels.length === 2 && labels.every((e) => e.decision === d) && labels.some((e) => e.outcome === 'true') && labels.some((e) => e.outcome === 'false');
      if (d === undefined) problems.push(`decision block ${b.id} has no decision`);
      if (!ok) problems.push(`decision block ${b.id} must have one true and one false edge of decision ${d}`);
    } else if (edges.length !== 1 || graph.edges[edges[0]].decision !== undefined || graph.edges[edges[0]].outcome !== undefined) {
      problems.push(`${b.kind} block ${b.id} must have exactly one unlabelled out-edge, has ${edges.length}`);
    }
  }
  if (exists(graph.exit)) {
    const reaches = new Uint8Array(n);
    const stack = [graph.exit];
    reaches[graph.exit] = 1;
    while (stack.length > 0) {
      for (const from of into[stack.pop()!]) {
        if (!reaches[from]) {
          reaches[from] = 1;
          stack.push(from);
        }
      }
    }
    for (let i = 0; i < n; i++) if (!reaches[i]) problems.push(`block ${i} never reaches the exit`);
  }
  return problems;
}
