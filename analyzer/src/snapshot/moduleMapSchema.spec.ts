import { ordersAndBilling, moduleRecord } from '../carve/fixtures/moduleMapSnapshot';
import { DEFAULT_MAP_SETTINGS, type Snapshot } from '../model';
import { SNAPSHOT_JSON_SCHEMA, snapshotSchemaProblems } from './validateSnapshot';

// The module-map half of the snapshot (issue 4) against docs/snapshot.schema.json.
function withMap(): Snapshot & Record<string, any> {
  const snapshot = ordersAndBilling();
  const filled: Snapshot = {
    ...snapshot,
    mapSettings: { ...DEFAULT_MAP_SETTINGS },
    imports: [{ from: 'src/orders/a.ts', to: 'src/orders/b.ts' }],
    externals: [{ package: 'lodash', calls: 3 }],
    modules: snapshot.modules!.map((m, i) => ({ ...m, instability: i === 0 ? 0.4 : null, abstractness: i === 1 ? 0.5 : null, cluster: i < 2 ? 'c1' : null, gravity: 40.5, gravityRank: i + 1, reasons: ['called from 2 of 2 clusters'] })),
    clusters: [{ id: 'c1', level: 'file', members: ['file:src/orders/a.ts', 'file:src/orders/b.ts'], functions: 3, cyclomatic: 6, decisions: 3, internalWeight: 4, externalWeight: 6 }],
    totals: { ...snapshot.totals, modularity: 0.0978, designComplexity: 9, integrationComplexity: 3 },
  };
  return JSON.parse(JSON.stringify(filled));
}

const problemsAfter = (mutate: (s: any) => void) => {
  const snapshot = withMap();
  mutate(snapshot);
  return snapshotSchemaProblems(snapshot).map((p) => `${p.path}: ${p.message}`);
};

describe('snapshot schema: the module map', () => {
  it('should accept a snapshot with calls, imports, externals, modules, module edges, clusters and map totals', () => {
    expect(snapshotSchemaProblems(withMap())).toEqual([]);
  });

  it('should type exactly the fields of the model’s module record', () => {
    const defs = (SNAPSHOT_JSON_SCHEMA as { $defs: Record<string, { required: string[]; properties: object }> }).$defs;
    const full = { ...moduleRecord('file', 'a.ts'), name: 'a' };
    expect(Object.keys(defs.moduleRecord.properties).sort()).toEqual(Object.keys(full).sort());
    expect([...defs.moduleRecord.required].sort()).toEqual(Object.keys(full).filter((k) => k !== 'name').sort());
  });

  it.each<[string, (s: any) => void, string]>([
    ['a call of an unknown kind', (s) => (s.calls[0].kind = 'invoke'), '/calls/0/kind: must be one of "call", "new", "reference"'],
    ['a call with no sites', (s) => (s.calls[0].count = 0), '/calls/0/count: must be >= 1'],
    ['a call with an unknown field', (s) => (s.calls[0].weight = 2), "/calls/0: unknown property 'weight'"],
    ['a module at an unknown level', (s) => (s.modules[0].level = 'repo'), '/modules/0/level: must be one of "file", "folder", "package"'],
    ['a module id without its level', (s) => (s.modules[0].id = 'src/a.ts'), '/modules/0/id: must match pattern'],
    ['an instability above 1', (s) => (s.modules[0].instability = 1.5), '/modules/0/instability: must be <= 1'],
    ['a module without gravity', (s) => delete s.modules[2].gravity, "/modules/2: missing required property 'gravity'"],
    ['a gravity above 100', (s) => (s.modules[1].gravity = 101), '/modules/1/gravity: must be <= 100'],
    ['an absolute module path', (s) => (s.modules[0].path = '/home/me/src'), '/modules/0/path: must not be an absolute path'],
    ['a negative module-edge weight', (s) => (s.moduleEdges[0].weight = -1), '/moduleEdges/0/weight: must be >= 0'],
    ['a mistyped map setting', (s) => (s.mapSettings.depth = 3), "/mapSettings: unknown property 'depth'"],
    ['cluster members that are not a list', (s) => (s.clusters[0].members = 'a,b'), '/clusters/0/members: must be array'],
    ['an external package without a name', (s) => (s.externals[0].package = ''), '/externals/0/package: must NOT have fewer than 1 characters'],
    ['a negative S0 total', (s) => (s.totals.designComplexity = -1), '/totals/designComplexity: must be >= 0'],
    ['a modularity that is not a number', (s) => (s.totals.modularity = 'high'), '/totals/modularity: must be number'],
    ['an iv(G) of 0', (s) => (s.functions[0].designComplexity = 0), '/functions/0/designComplexity: must be >= 1'],
  ])('should reject %s', (_name, mutate, expected) => {
    expect(problemsAfter(mutate).some((p) => p.startsWith(expected))).toBe(true);
  });
});
