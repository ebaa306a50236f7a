// Parsed back with @xmldom/xmldom (a test-only import, present through the SAML packages): a
// general-purpose XML parser the project did not write checks that the document is well formed.
import { DOMParser } from '@xmldom/xmldom';
import { mapSnapshot, moduleEdge, moduleRecord } from '../carve/fixtures/moduleMapSnapshot';
import type { ModuleRecord, Snapshot } from '../model';
import { toGraphml } from './graphml';
import { MODULE_COLUMNS } from './modulesCsv';

const GRAPHML_NS = 'http://graphml.graphdrawing.org/xmlns';

function parse(text: string): Document {
  const problems: string[] = [];
  const report = (message: string) => problems.push(message);
  const doc = new DOMParser({ errorHandler: { warning: report, error: report, fatalError: report } }).parseFromString(text, 'application/xml');
  expect(problems).toEqual([]);
  return doc as unknown as Document;
}

const elements = (parent: Document | Element, name: string) => Array.from(parent.getElementsByTagNameNS(GRAPHML_NS, name));

/** Each node's or edge's data as attr.name → text, through the declared keys. */
function attributes(doc: Document, element: Element): Record<string, string> {
  const names = new Map(elements(doc, 'key').map((k) => [k.getAttribute('id')!, k.getAttribute('attr.name')!]));
  const own = Array.from(element.childNodes).filter((n): n is Element => n.nodeType === 1 && (n as Element).localName === 'data');
  return Object.fromEntries(own.map((d) => [names.get(d.getAttribute('key')!)!, d.textContent ?? '']));
}

function sample(): Snapshot {
  const core = moduleRecord('file', 'src/core & <more> "quoted" it\'s\u0007.ts', {
    name: 'core',
    functions: 12,
    cyclomatic: 40,
    decisions: 28,
    instability: 0.25,
    abstractness: null,
    cluster: 'c1',
    gravity: 87.5,
    gravityRank: 1,
    reasons: ['called from 7 of 9 clusters', 'ΣV 412, 6× the median module'],
  });
  const util = moduleRecord('file', 'src/util.ts', { functions: 3, cyclomatic: 4, decisions: 1 });
  return mapSnapshot([], {
    modules: [core, util, moduleRecord('folder', 'src')],
    moduleEdges: [{ ...moduleEdge('file', 'src/util.ts', 'x', 1, 0), to: core.id }, moduleEdge('file', 'src/util.ts', 'gone.ts', 2, 1), moduleEdge('folder', 'src', 'src', 1, 1)],
  });
}

describe('toGraphml', () => {
  const snapshot = sample();
  const doc = parse(toGraphml(snapshot, 'file'));

  it('should be a well-formed GraphML document with a directed graph', () => {
    expect(doc.documentElement.localName).toBe('graphml');
    expect(doc.documentElement.namespaceURI).toBe(GRAPHML_NS);
    const [graph] = elements(doc, 'graph');
    expect(graph.getAttribute('edgedefault')).toBe('directed');
    expect(attributes(doc, graph)).toEqual({ level: 'file', root: 'demo' });
  });

  it('should declare a typed key for every field of a module record and every edge attribute', () => {
    const keys = elements(doc, 'key').map((k) => [k.getAttribute('for'), k.getAttribute('attr.name'), k.getAttribute('attr.type')]);
    const full: Required<ModuleRecord> = { ...moduleRecord('file', 'a.ts'), name: 'a' };
    const nodeKeys = keys.filter(([kind]) => kind === 'node').map(([, name]) => name);
    expect([...nodeKeys].sort()).toEqual(Object.keys(full).sort());
    expect(keys).toEqual(expect.arrayContaining([['node', 'functions', 'int'], ['node', 'instability', 'double'], ['node', 'path', 'string'], ['edge', 'weight', 'double'], ['edge', 'calls', 'int'], ['edge', 'imports', 'int']]));
    for (const [, , type] of keys) expect(['int', 'double', 'string', 'boolean', 'long', 'float']).toContain(type);
  });

  it('should carry each module’s values, escaped, with nulls left out', () => {
    const nodes = elements(doc, 'node').map((n) => attributes(doc, n));
    expect(nodes).toHaveLength(2);
    expect(nodes[0]).toMatchObject({
      id: 'file:src/core & <more> "quoted" it\'s\uFFFD.ts',
      name: 'core',
      functions: '12',
      cyclomatic: '40',
      instability: '0.25',
      cluster: 'c1',
      gravity: '87.5',
      reasons: 'called from 7 of 9 clusters; ΣV 412, 6× the median module',
    });
    expect(nodes[0]).not.toHaveProperty('abstractness');
    expect(nodes[1]).not.toHaveProperty('cluster');
    expect(nodes[1]).not.toHaveProperty('name');
    expect(Object.keys(nodes[1])).toHaveLength(MODULE_COLUMNS.length - 4); // name, instability, abstractness, cluster are null
  });

  it('should give each edge between two of the level’s modules, with its weight, calls and imports', () => {
    const edges = elements(doc, 'edge');
    expect(edges.map((e) => [e.getAttribute('source'), e.getAttribute('target'), attributes(doc, e)])).toEqual([['n1', 'n0', { weight: '1', calls: '1', imports: '0' }]]);
  });

  it('should export another level on its own and an empty map as an empty graph', () => {
    const folder = parse(toGraphml(snapshot, 'folder'));
    expect(elements(folder, 'node').map((n) => attributes(folder, n).id)).toEqual(['folder:src']);
    expect(elements(folder, 'edge')).toHaveLength(1);
    const empty = parse(toGraphml(mapSnapshot([], {}), 'package'));
    expect([elements(empty, 'node').length, elements(empty, 'edge').length, elements(empty, 'graph').length]).toEqual([0, 0, 1]);
  });
});
