import dagre from '@dagrejs/dagre';

import { kindName, kindTag, outcomeWord } from './decision-wording';
import type { CompactGraph, Outcome } from './flow-types';

/** What a drawn block is. */
export type DrawnBlockKind = 'entry' | 'exit' | 'decision' | 'code' | 'join';

/** A block placed by the layout (x, y: its centre). */
export interface DrawnBlock {
  id: number;
  kind: DrawnBlockKind;
  x: number;
  y: number;
  width: number;
  height: number;
  /** First text line: "entry", "exit", the decision's condition or the block's lines. */
  title: string;
  /** Second text line (a decision's line), or empty. */
  subtitle: string;
  /** The whole description for screen readers. */
  ariaLabel: string;
  /** The decision this block tests, if any. */
  decision: number | null;
  /** 1-based file lines the block covers, or null for entry, exit and empty joins. */
  lines: { from: number; to: number } | null;
}

/** An edge placed by the layout. */
export interface DrawnEdge {
  /** Index into `graph.edges`. */
  index: number;
  from: number;
  to: number;
  /** SVG path data through the layout's points. */
  path: string;
  decision: number | null;
  outcome: Outcome | null;
  /** The outcome's word ("true", "enter", "matches"…), or empty. */
  label: string;
  labelX: number;
  labelY: number;
}

/** A flow graph ready to draw as SVG. */
export interface FlowLayout {
  blocks: DrawnBlock[];
  edges: DrawnEdge[];
  width: number;
  height: number;
}

/** Most characters of a condition shown inside its block (the full text is in the label). */
export const MAX_TITLE_CHARS = 24;
/** Approximate width of one character at the graph's font size. */
const CHAR_WIDTH = 7;
const LABEL_CHAR_WIDTH = 6.2;

/**
 * Lays a compact flow graph out top to bottom in layers (dagre's layered layout): entry at the
 * top, blocks sized to their text, parallel edges kept apart, outcome words placed on the
 * decision edges.
 */
export function layoutFlowGraph(graph: CompactGraph): FlowLayout {
  const blocks = graph.blocks.map((_, id) => describeBlock(graph, id));
  const g = new dagre.graphlib.Graph({ multigraph: true });
  g.setGraph({ rankdir: 'TB', nodesep: 20, ranksep: 30, edgesep: 12, marginx: 16, marginy: 16 });
  g.setDefaultEdgeLabel(() => ({}));
  for (const block of blocks) {
    g.setNode(String(block.id), { width: block.width, height: block.height });
  }
  graph.edges.forEach((edge, index) => {
    const label = edge.length === 4 ? outcomeWord(graph.decisions[edge[2]].kind, edge[3] === 1 ? 'true' : 'false') : '';
    const labelSize = label ? { width: label.length * LABEL_CHAR_WIDTH + 8, height: 16, labelpos: 'c' as const } : {};
    g.setEdge(String(edge[0]), String(edge[1]), { label, ...labelSize }, String(index));
  });
  dagre.layout(g);

  for (const block of blocks) {
    const placed = g.node(String(block.id));
    block.x = placed.x ?? 0;
    block.y = placed.y ?? 0;
  }
  const edges = graph.edges.map((edge, index): DrawnEdge => {
    const placed = g.edge(String(edge[0]), String(edge[1]), String(index));
    const points = placed.points ?? [];
    const decision = edge.length === 4 ? edge[2] : null;
    const outcome: Outcome | null = edge.length === 4 ? (edge[3] === 1 ? 'true' : 'false') : null;
    return {
      index,
      from: edge[0],
      to: edge[1],
      path: svgPath(points),
      decision,
      outcome,
      label: typeof placed['label'] === 'string' ? placed['label'] : '',
      labelX: placed.x ?? 0,
      labelY: placed.y ?? 0,
    };
  });
  const size = g.graph();
  return { blocks, edges, width: Math.ceil(size.width ?? 0), height: Math.ceil(size.height ?? 0) };
}

/** A block's kind, text and size before layout. */
export function describeBlock(graph: CompactGraph, id: number): DrawnBlock {
  const span = graph.blocks[id];
  const lines = span ? { from: span[0], to: span[2] } : null;
  const base = { id, x: 0, y: 0, lines, decision: null, subtitle: '' };
  if (id === graph.entry) return { ...base, kind: 'entry', title: 'entry', ariaLabel: 'Entry', width: 64, height: 28 };
  if (id === graph.exit) return { ...base, kind: 'exit', title: 'exit', ariaLabel: 'Exit', width: 64, height: 28 };
  const decision = graph.decisions.findIndex((d) => d.block === id);
  if (decision >= 0) {
    const d = graph.decisions[decision];
    const title = truncate(d.text, MAX_TITLE_CHARS);
    const subtitle = `line ${d.span.line} · ${kindTag(d.kind)}`;
    return {
      ...base,
      kind: 'decision',
      decision,
      title,
      subtitle,
      ariaLabel: `Decision ${decision + 1}, ${kindName(d.kind)} on line ${d.span.line}: ${d.text}`,
      width: Math.max(title.length, subtitle.length) * CHAR_WIDTH + 24,
      height: 40,
    };
  }
  if (!lines) return { ...base, kind: 'join', title: '', ariaLabel: `Join point ${id}`, width: 14, height: 14 };
  const title = lineRange(lines.from, lines.to);
  return { ...base, kind: 'code', title, ariaLabel: `Code block, ${title}`, width: title.length * CHAR_WIDTH + 20, height: 28 };
}

/** "line 12" or "lines 12–15". */
export function lineRange(from: number, to: number): string {
  return from === to ? `line ${from}` : `lines ${from}–${to}`;
}

function truncate(text: string, max: number): string {
  return text.length <= max ? text : `${text.slice(0, max - 1)}…`;
}

/** A smooth SVG path through the points: straight ends, quadratic bends at the inner points. */
export function svgPath(points: readonly { x: number; y: number }[]): string {
  if (points.length === 0) return '';
  const f = (n: number) => Math.round(n * 10) / 10;
  let d = `M${f(points[0].x)},${f(points[0].y)}`;
  for (let i = 1; i < points.length - 1; i++) {
    const next = points[i + 1];
    const midX = (points[i].x + next.x) / 2;
    const midY = (points[i].y + next.y) / 2;
    d += ` Q${f(points[i].x)},${f(points[i].y)} ${f(midX)},${f(midY)}`;
  }
  const last = points[points.length - 1];
  if (points.length > 1) d += ` L${f(last.x)},${f(last.y)}`;
  return d;
}
