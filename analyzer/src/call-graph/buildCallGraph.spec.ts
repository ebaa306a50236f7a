import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { DEFAULT_SETTINGS } from '../model';
import { buildCallGraph } from './buildCallGraph';
import { fixtureGraph, type NamedGraph } from './fixtures/fixtureGraph';

// Every expected graph below was worked out by hand from the fixture's source (// hand-verified);
// resolution rules are the TypeScript checker's (common practice).
const fixture = (name: string) => path.join(__dirname, 'fixtures', name);

function expectIdsKnown(g: NamedGraph): void {
  expect(g.unknownIds).toEqual([]);
  expect(g.graph.failedFiles).toEqual([]);
}

describe('buildCallGraph on hand-verified fixtures', () => {
  it('resolves plain calls within and across files, and calls from top-level code', () => {
    const g = fixtureGraph(fixture('plain-calls'));
    expectIdsKnown(g);
    expect(g.edges).toEqual([
      'main.ts#<top-level> -> main.ts#report call ×1',
      'main.ts#<top-level> -> math.ts#twice call ×1',
      'main.ts#report -> math.ts#add call ×1',
      'main.ts#report -> math.ts#twice call ×1',
      'math.ts#twice -> math.ts#add call ×1',
    ]);
    expect(g.imports).toEqual(['main.ts -> math.ts']);
    // `return twice(add(1, 2));` — line 4, the called names at columns 10 and 16.
    expect(g.perFunction.get('main.ts#report')).toEqual({ unresolved: 0, external: 0, sites: ['4:10 math.ts#twice', '4:16 math.ts#add'] });
    expect(g.graph.externals).toEqual([]);
  });

  it('resolves constructors, methods, static methods, super() and accessors', () => {
    const g = fixtureGraph(fixture('classes'));
    expectIdsKnown(g);
    expect(g.edges).toEqual([
      // `this.value = this.value + 1` writes through the setter and reads through the getter.
      'counter.ts#Counter.bump -> counter.ts#get Counter.value call ×1',
      'counter.ts#Counter.bump -> counter.ts#set Counter.value call ×1',
      'counter.ts#Counter.constructor -> counter.ts#Base.constructor call ×1',
      'counter.ts#Counter.create -> counter.ts#Counter.constructor new ×1',
      'counter.ts#Counter.increment -> counter.ts#Counter.bump call ×1',
      'use.ts#useCounter -> counter.ts#Counter.constructor new ×1',
      'use.ts#useCounter -> counter.ts#Counter.create call ×1',
      'use.ts#useCounter -> counter.ts#Counter.increment call ×2',
      'use.ts#useCounter -> counter.ts#get Counter.value call ×1',
      'use.ts#usePlain -> counter.ts#Plain.hello call ×1',
    ]);
    // `new Plain()` runs no unit (Plain has no constructor): a site without target, neither unresolved nor external.
    expect(g.perFunction.get('use.ts#usePlain')).toEqual({ unresolved: 0, external: 0, sites: ['12:22 counter.ts#Plain.hello', '12:10 -'] });
    expect(g.imports).toEqual(['use.ts -> counter.ts']);
  });

  it('follows named, re-exported, renamed, default, namespace and dynamic imports and aliases', () => {
    const g = fixtureGraph(fixture('imports'));
    expectIdsKnown(g);
    expect(g.edges).toEqual([
      'main.ts#load -> lazy.ts#later call ×1',
      // alpha(), ns.alpha() and f() with `const f = alpha`.
      'main.ts#run -> lib/impl.ts#alpha call ×3',
      'main.ts#run -> lib/impl.ts#alpha reference ×1',
      'main.ts#run -> lib/impl.ts#beta call ×1',
      // delta() (gamma renamed by `export { gamma as delta } from`) and ns.gamma().
      'main.ts#run -> lib/impl.ts#gamma call ×2',
    ]);
    expect(g.imports).toEqual(['lib/index.ts -> lib/impl.ts', 'main.ts -> lazy.ts', 'main.ts -> lib/impl.ts', 'main.ts -> lib/index.ts']);
  });

  it('dispatches through interfaces and abstract methods to declared implementations only, as uncertain', () => {
    const g = fixtureGraph(fixture('dispatch'));
    expectIdsKnown(g);
    expect(g.edges).toEqual([
      // Walker and Jogger implement Runner, Sprinter through FastRunner; SlowWalker inherits
      // Walker.run (no new target); LookAlike has the shape but not the `implements`.
      'main.ts#go -> runner.ts#Jogger.run call? ×1',
      'main.ts#go -> runner.ts#Sprinter.run call? ×1',
      'main.ts#go -> runner.ts#Walker.run call? ×1',
      'main.ts#measure -> shape.ts#Circle.area call? ×1',
      'main.ts#measure -> shape.ts#Square.area call? ×1',
      'runner.ts#Sprinter.run -> runner.ts#Sprinter.sprint call ×1',
      'shape.ts#Shape.describe -> shape.ts#Circle.area call? ×1',
      'shape.ts#Shape.describe -> shape.ts#Square.area call? ×1',
    ]);
    // `super()` into Shape, which has no constructor: resolved, but no unit runs.
    expect(g.perFunction.get('shape.ts#Square.constructor')).toEqual({ unresolved: 0, external: 0, sites: ['11:5 -'] });
    // One call site, three targets.
    expect(g.perFunction.get('main.ts#go')!.sites).toHaveLength(1);
  });

  it('makes functions passed as values reference edges and counts .map as a standard-library call', () => {
    const g = fixtureGraph(fixture('callbacks'));
    expectIdsKnown(g);
    expect(g.edges).toEqual([
      'numbers.ts#<top-level> -> numbers.ts#double reference ×1',
      'numbers.ts#Button.press -> numbers.ts#Button.clicked reference ×1',
      'numbers.ts#doubleAll -> numbers.ts#double reference ×1',
      'numbers.ts#pick -> numbers.ts#double reference ×1',
    ]);
    expect(g.perFunction.get('numbers.ts#doubleAll')).toEqual({ unresolved: 0, external: 1, sites: ['8:13 -'] });
    // xs.map(…) and this.clicked.bind(…).
    expect(g.graph.externals).toEqual([{ package: 'typescript-lib', calls: 2 }]);
  });

  it('counts calls it cannot resolve instead of dropping them', () => {
    const g = fixtureGraph(fixture('unresolved'));
    expectIdsKnown(g);
    expect(g.edges).toEqual([]);
    expect(g.perFunction.get('dynamic.ts#byName')).toEqual({ unresolved: 1, external: 0, sites: ['6:16 -'] });
    expect(g.perFunction.get('dynamic.ts#loose')).toEqual({ unresolved: 2, external: 0, sites: ['10:9 -', '11:10 -'] });
    expect(g.perFunction.get('dynamic.ts#withCallback')).toEqual({ unresolved: 1, external: 0, sites: ['15:3 -'] });
    expect(g.perFunction.get('missing.ts#haunt')).toEqual({ unresolved: 1, external: 0, sites: ['5:3 -'] });
  });

  it('resolves CommonJS JavaScript to the scanned .js even with a .d.ts beside it', () => {
    const g = fixtureGraph(fixture('commonjs'));
    expectIdsKnown(g);
    expect(g.edges).toEqual(['main.js#<top-level> -> main.js#main reference ×1', 'main.js#main -> helpers.js#helper call ×1']);
    expect(g.imports).toEqual(['main.js -> helpers.js']);
  });

  describe('calls into node_modules', () => {
    let root: string;
    beforeAll(() => {
      // The fake packages live under `packages/` in the repository (node_modules is ignored by git).
      root = fs.mkdtempSync(path.join(os.tmpdir(), 'seamline-calls-'));
      fs.cpSync(fixture('external-package'), root, { recursive: true });
      fs.renameSync(path.join(root, 'packages'), path.join(root, 'node_modules'));
    });
    afterAll(() => fs.rmSync(root, { recursive: true, force: true }));

    it('groups them per package, most calls first, and makes no edges of them', () => {
      const g = fixtureGraph(root);
      expectIdsKnown(g);
      expect(g.edges).toEqual([]);
      // new Point() twice and distance() in fake-geo; format() in @fixture/fmt; Math.max in the standard library.
      expect(g.graph.externals).toEqual([
        { package: 'fake-geo', calls: 3 },
        { package: '@fixture/fmt', calls: 1 },
        { package: 'typescript-lib', calls: 1 },
      ]);
      expect(g.perFunction.get('src/app.ts#describe')).toMatchObject({ unresolved: 0, external: 5 });
    });
  });

  describe('failures stay with their file', () => {
    let root: string;
    beforeAll(() => {
      root = fs.mkdtempSync(path.join(os.tmpdir(), 'seamline-calls-'));
      fs.writeFileSync(path.join(root, 'good.ts'), 'export function f(x: number): number { return x; }\nexport function g(): number { return f(1); }\n');
      // Under Node's default stack (~1 MB, as jest runs): 700 nested calls parse but exhaust the
      // checker's stack (measured here: it fails from about 500); 30,000 exhaust the parser's.
      fs.writeFileSync(path.join(root, 'deep.ts'), `import { f } from './good';\nexport const v = ${'f('.repeat(700)}1${')'.repeat(700)};\n`);
      fs.writeFileSync(path.join(root, 'deeper.ts'), `import { f } from './good';\nexport const v = ${'f('.repeat(30000)}1${')'.repeat(30000)};\n`);
    });
    afterAll(() => fs.rmSync(root, { recursive: true, force: true }));

    it('reports the files it could not get through and keeps the others', () => {
      const graph = buildCallGraph({ root, files: ['deep.ts', 'deeper.ts', 'good.ts'], settings: DEFAULT_SETTINGS });
      expect(graph.failedFiles.map((f) => f.file)).toEqual(['deep.ts', 'deeper.ts']);
      // 700 levels sit near both limits: how much stack the jest worker has left decides whether
      // the checker or already the parser runs out, so either phase is reported for this file.
      expect(graph.failedFiles[0].detail).toMatch(/^analyzer\/call-graph: (resolving calls|parsing) failed: RangeError: Maximum call stack/);
      expect(graph.failedFiles[1].detail).toMatch(/^analyzer\/call-graph: parsing failed: RangeError: Maximum call stack/);
      expect(graph.calls).toHaveLength(1);
      expect(graph.imports).toEqual([]);
    });
  });
});
