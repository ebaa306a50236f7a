/**
 * Hand-built flow graphs for the coverage specs
 * =============================================
 * `testGraph('0>1; 1?2:3 if 2:5-2:9; 2>4; 3>4; 4>5', { 1: 2, 2: [3, 4] })`: `a>b` is a plain
 * edge, `a?t:f kind line:col-endLine:endCol [#switchIndex]` a decision at block a. The second
 * argument gives code blocks their lines (one line or [line, endLine]); decision blocks take
 * their decision's span. Entry is block 0, exit the highest id. Test support only.
 */
import type { BasicBlock, Decision, DecisionKind, FlowEdge, FlowGraph, SourceSpan } from '../model';

/** Builds a graph from the edge language above. */
export function testGraph(spec: string, lines: Record<number, number | [number, number]> = {}): FlowGraph {
  const edges: FlowEdge[] = [];
  const decisions: Decision[] = [];
  let maxId = 0;
  for (const raw of spec.split(';').map((s) => s.trim()).filter(Boolean)) {
    const plain = /^(\d+)>(\d+)$/.exec(raw);
    const branch = /^(\d+)\?(\d+):(\d+) ([a-z-]+) (\d+):(\d+)-(\d+):(\d+)(?: #(\d+))?$/.exec(raw);
    if (plain) {
      edges.push({ from: Number(plain[1]), to: Number(plain[2]) });
      maxId = Math.max(maxId, Number(plain[1]), Number(plain[2]));
      continue;
    }
    if (!branch) throw new SyntaxError(`coverage/testGraph: cannot read "${raw}"`);
    const [block, t, f, line, column, endLine, endColumn] = [1, 2, 3, 5, 6, 7, 8].map((i) => Number(branch[i]));
    const id = decisions.length;
    const span: SourceSpan = { line, column, endLine, endColumn };
    decisions.push({ id, kind: branch[4] as DecisionKind, block, span, text: `c${id}`, ...(branch[9] ? { switchIndex: Number(branch[9]) } : {}) });
    edges.push({ from: block, to: t, decision: id, outcome: 'true' }, { from: block, to: f, decision: id, outcome: 'false' });
    maxId = Math.max(maxId, block, t, f);
  }
  const blocks: BasicBlock[] = [];
  for (let id = 0; id <= maxId; id++) {
    const decision = decisions.find((d) => d.block === id);
    const given = lines[id];
    const kind = id === 0 ? 'entry' : id === maxId ? 'exit' : decision ? 'decision' : 'code';
    const span = decision
      ? decision.span
      : given === undefined
        ? undefined
        : { line: Array.isArray(given) ? given[0] : given, column: 1, endLine: Array.isArray(given) ? given[1] : given, endColumn: 80 };
    blocks.push(span ? { id, kind, span } : { id, kind });
  }
  return { blocks, edges, decisions, entry: 0, exit: maxId };
}
