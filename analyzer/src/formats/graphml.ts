/**
 * The module map as GraphML
 * =========================
 * One level of the module map as a GraphML 1.0 document: a `<key>` per attribute (every field
 * of a module record, typed int, double or string; a gravity score's reasons joined with "; ";
 * the edges' weight, calls and imports; the level and root on the graph), then a directed
 * `<graph>` with a `<node>` per module and an `<edge>` per module edge. Node ids are n0, n1, …
 * because module ids hold `/`, which an XML name token may not; the module id is the `id`
 * attribute. Null values are left out (GraphML's "no value"). Text is XML-escaped, and
 * characters XML 1.0 cannot carry (control characters, lone surrogates) become U+FFFD. Edges
 * whose ends are not modules of the level are left out.
 *
 * [Reference]: GraphML 1.0, graphml.graphdrawing.org (the GraphML Primer: keys, data, graph,
 * node, edge); W3C XML 1.0 §2.2 (characters) and §2.4 (escaping).
 */
import type { ModuleEdge, ModuleLevel } from '../model/ModuleMap';
import type { Snapshot } from '../model/Snapshot';
import { MODULE_COLUMNS, type ColumnType } from './modulesCsv';

const EDGE_COLUMNS: [string, ColumnType, (e: ModuleEdge) => number][] = [
  ['weight', 'double', (e) => e.weight],
  ['calls', 'int', (e) => e.calls],
  ['imports', 'int', (e) => e.imports],
];

const ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' };
const NOT_XML = /[^\x09\x0A\x0D\x20-\uD7FF\uE000-\uFFFD\u{10000}-\u{10FFFF}]/gu;

/** Text safe inside an XML attribute or element. */
function xml(text: string): string {
  return text.replace(NOT_XML, '\uFFFD').replace(/[&<>"']/g, (c) => ESCAPES[c]);
}

function data(key: string, value: string | number | null | undefined): string {
  if (value === null || value === undefined || (typeof value === 'number' && !Number.isFinite(value))) return '';
  return `<data key="${key}">${xml(String(value))}</data>`;
}

/** The module map of `level` as a GraphML document (see the file header). */
export function toGraphml(snapshot: Snapshot, level: ModuleLevel): string {
  const modules = (snapshot.modules ?? []).filter((m) => m.level === level);
  const nodeId = new Map(modules.map((m, i) => [m.id, `n${i}`]));
  const lines = [
    '<?xml version="1.0" encoding="UTF-8"?>',
    '<graphml xmlns="http://graphml.graphdrawing.org/xmlns" xmlns:xsi="http://www.w3.org/2001/XMLSchema-instance" xsi:schemaLocation="http://graphml.graphdrawing.org/xmlns http://graphml.graphdrawing.org/xmlns/1.0/graphml.xsd">',
    '  <key id="g_level" for="graph" attr.name="level" attr.type="string"/>',
    '  <key id="g_root" for="graph" attr.name="root" attr.type="string"/>',
    ...MODULE_COLUMNS.map(([name, type]) => `  <key id="n_${name}" for="node" attr.name="${name}" attr.type="${type}"/>`),
    ...EDGE_COLUMNS.map(([name, type]) => `  <key id="e_${name}" for="edge" attr.name="${name}" attr.type="${type}"/>`),
    '  <graph id="modules" edgedefault="directed">',
    `    ${data('g_level', level)}${data('g_root', snapshot.root)}`,
  ];
  for (const m of modules) lines.push(`    <node id="${nodeId.get(m.id)}">${MODULE_COLUMNS.map(([name, , value]) => data(`n_${name}`, value(m))).join('')}</node>`);
  let edges = 0;
  for (const e of snapshot.moduleEdges ?? []) {
    const source = nodeId.get(e.from);
    const target = nodeId.get(e.to);
    if (e.level !== level || source === undefined || target === undefined) continue;
    lines.push(`    <edge id="e${edges++}" source="${source}" target="${target}">${EDGE_COLUMNS.map(([name, , value]) => data(`e_${name}`, value(e))).join('')}</edge>`);
  }
  lines.push('  </graph>', '</graphml>', '');
  return lines.join('\n');
}
