import * as fs from 'node:fs';
import * as path from 'node:path';
import { analyzeSource } from '../analyzeSource';
import { DEFAULT_SETTINGS } from '../model';
import { buildCallGraph, STANDARD_LIBRARY } from './buildCallGraph';
import { sourceFilesUnder } from './fixtures/fixtureGraph';

// A real codebase: the TypeScript sources the rxjs package ships (installed by `npm ci`).
const root = path.resolve(__dirname, '../../../node_modules/rxjs/src');

describe('buildCallGraph on rxjs src (smoke test)', () => {
  it('finishes, resolves over a thousand call sites, fails no file, and uses only ids analyzeSource gives', () => {
    const files = sourceFilesUnder(root);
    expect(files.length).toBeGreaterThan(200);
    const ids = new Set<string>();
    for (const file of files) {
      for (const f of analyzeSource(file, fs.readFileSync(path.join(root, file), 'utf8'), DEFAULT_SETTINGS).functions) ids.add(f.id);
    }

    const graph = buildCallGraph({ root, files, settings: DEFAULT_SETTINGS });

    expect(graph.failedFiles).toEqual([]);
    const sites = graph.calls.reduce((n, e) => n + (e.kind === 'reference' ? 0 : e.count), 0);
    // Measured on rxjs 7.8.2: ~1,460 merged edges over ~1,900 call sites; ~1,200 imports.
    expect(graph.calls.length).toBeGreaterThan(1000);
    expect(sites).toBeGreaterThan(1000);
    expect(graph.imports.length).toBeGreaterThan(500);
    const strays = graph.calls.filter((e) => !ids.has(e.from) || !ids.has(e.to));
    expect(strays).toEqual([]);
    expect([...graph.perFunction.keys()].filter((id) => !ids.has(id))).toEqual([]);
    // Every unit of every file is there (no file failed).
    expect(graph.perFunction.size).toBe(ids.size);
    const importEnds = new Set(files);
    expect(graph.imports.filter((i) => !importEnds.has(i.from) || !importEnds.has(i.to))).toEqual([]);

    for (const kind of ['call', 'new', 'reference'] as const) expect(graph.calls.some((e) => e.kind === kind)).toBe(true);
    // rxjs dispatches through interfaces (SchedulerLike, SubscriptionLike…) and abstract classes.
    expect(graph.calls.some((e) => !e.certain)).toBe(true);
    expect(graph.externals.map((x) => x.package)).toContain(STANDARD_LIBRARY);
  }, 120_000);
});
