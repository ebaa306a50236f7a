import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Snapshot } from '../model';
import { chainGraph, syntheticFunction, syntheticSnapshot } from './fixtures/syntheticSnapshot';
import { SNAPSHOT_JSON_SCHEMA, snapshotSchemaProblems } from './validateSnapshot';

// A deep copy that tests may break freely.
function valid(): Snapshot & Record<string, unknown> {
  const snapshot = syntheticSnapshot([
    syntheticFunction({ cyclomatic: 1, line: 1 }),
    syntheticFunction({ cyclomatic: 4, line: 10, qualifiedName: 'Orders.assign', kind: 'method' }),
  ]);
  return JSON.parse(JSON.stringify(snapshot));
}

function problemsAfter(mutate: (s: any) => void): string[] {
  const snapshot = valid();
  mutate(snapshot);
  return snapshotSchemaProblems(snapshot).map((p) => `${p.path}: ${p.message}`);
}

describe('snapshotSchemaProblems', () => {
  it('should accept a synthetic snapshot whose graphs satisfy E − N + 2 = V', () => {
    const snapshot = valid();
    for (const fn of snapshot.functions) expect(fn.edges - fn.nodes + 2).toBe(fn.cyclomatic);
    expect(snapshotSchemaProblems(snapshot)).toEqual([]);
  });

  it('should accept the optional parts: coverage, source, skipped files and later additive arrays', () => {
    const snapshot = valid();
    snapshot.functions[1].source = 'function assign() {}';
    snapshot.functions[1].coverage = {
      outcomesCovered: 4,
      outcomesTotal: 6,
      outcomes: [[true, true], [true, false], [true, false]],
      actualComplexity: 2,
      untestedPaths: 2,
      crap: 4.59,
    };
    snapshot.coverage = { format: 'lcov', unmatchedFiles: ['gone.ts'] };
    snapshot.files.skipped.push({ file: 'dist/app.min.js', reason: 'minified', detail: 'a line of 40,000 characters' });
    (snapshot as unknown as Record<string, unknown>).laterTable = [{ id: 'src' }]; // an additive field of a later version
    expect(snapshotSchemaProblems(snapshot)).toEqual([]);
  });

  it('should be the file shipped in docs/', () => {
    const docs = JSON.parse(readFileSync(path.join(__dirname, '../../../docs/snapshot.schema.json'), 'utf8'));
    expect(SNAPSHOT_JSON_SCHEMA).toEqual(docs);
    expect(docs.$schema).toBe('https://json-schema.org/draft/2020-12/schema');
  });

  it.each<[string, (s: any) => void, string]>([
    ['a missing required field', (s) => delete s.functions[1].cyclomatic, "/functions/1: missing required property 'cyclomatic'"],
    ['a missing top-level field', (s) => delete s.totals, "(top): missing required property 'totals'"],
    ['a count that is not an integer', (s) => (s.functions[0].loc = 2.5), '/functions/0/loc: must be integer'],
    ['a V(G) below 1', (s) => (s.functions[0].cyclomatic = 0), '/functions/0/cyclomatic: must be >= 1'],
    ['an unknown kind', (s) => (s.functions[0].kind = 'lambda'), '/functions/0/kind: must be one of "function", "method"'],
    ['an unknown switch setting', (s) => (s.settings.switch = 'each'), '/settings/switch: must be one of "cases", "one"'],
    ['a mistyped setting name', (s) => (s.settings.optionalChains = true), "/settings: unknown property 'optionalChains'"],
    ['an absolute root', (s) => (s.root = '/home/me/project'), '/root: must not be an absolute path'],
    ['an absolute file path', (s) => (s.functions[0].file = 'C:/abs/app.ts'), '/functions/0/file: must not be an absolute path'],
    ['a bad timestamp', (s) => (s.createdAt = 'yesterday'), '/createdAt: must match format "date-time"'],
    ['another generator', (s) => (s.generator.name = 'other'), '/generator/name: must be "seamline"'],
    ['an edge of three numbers', (s) => s.functions[1].graph.edges.push([1, 2, 3]), '/functions/1/graph/edges/10: must be [from, to] or [from, to, decision, outcome]'],
    ['an edge outcome of 2', (s) => (s.functions[1].graph.edges[1][3] = 2), '/functions/1/graph/edges/1: must be [from, to] or [from, to, decision, outcome]'],
    ['a block with a string', (s) => (s.functions[1].graph.blocks[2][0] = 'x'), '/functions/1/graph/blocks/2: must be null or [line, column, endLine, endColumn]'],
    ['an unknown decision kind', (s) => (s.functions[1].graph.decisions[0].kind = 'unless'), '/functions/1/graph/decisions/0/kind: must be one of'],
    ['a condition text over 120 characters', (s) => (s.functions[1].graph.decisions[0].text = 'x'.repeat(121)), '/functions/1/graph/decisions/0/text: must NOT have more than 120 characters'],
    ['a skipped file with an unknown reason', (s) => s.files.skipped.push({ file: 'a.ts', reason: 'boring' }), '/files/skipped/0/reason: must be one of'],
    ['functions that are not an array', (s) => (s.functions = {}), '/functions: must be array'],
  ])('should reject %s with the path and the problem', (_name, mutate, expected) => {
    const problems = problemsAfter(mutate).map((p) => p.replace(/^: /, '(top): '));
    expect(problems.some((p) => p.startsWith(expected))).toBe(true);
  });

  it('should report one line per broken edge, not one per oneOf branch', () => {
    const problems = problemsAfter((s) => s.functions[1].graph.edges.push([1, 2, 3]));
    expect(problems).toHaveLength(1);
  });

  it('should report every problem, not only the first', () => {
    const problems = problemsAfter((s) => {
      s.functions[0].loc = -1;
      s.functions[1].essential = 'high';
    });
    expect(problems).toEqual(expect.arrayContaining(['/functions/0/loc: must be >= 0', '/functions/1/essential: must be integer']));
  });

  it('should build graphs that match the chain helper for zero decisions', () => {
    // Sequence: V = 1 (McCabe 1976, IEEE TSE SE-2(4): a straight-line program has v = 1).
    const graph = chainGraph(0);
    expect(graph.edges.length - graph.blocks.length + 2).toBe(1);
  });
});
