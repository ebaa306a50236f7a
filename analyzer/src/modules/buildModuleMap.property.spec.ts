import fc from 'fast-check';
import { integrationComplexity } from '../design/integrationComplexity';
import type { FunctionRecord, ModuleLevel, ModuleRecord } from '../model';
import { buildModuleMap, type ModuleMapInput } from './buildModuleMap';
import { call, input, topLevel, unit } from './fixtures/records';
import { folderOf, PackageLocator } from './moduleOfFile';

const SEGMENTS = ['src', 'lib', 'orders', 'billing', 'ui'];

/** Generated codebases: files in random folders, functions with consistent numbers, random calls and imports. */
const codebase: fc.Arbitrary<ModuleMapInput> = fc
  .record({
    files: fc.uniqueArray(fc.array(fc.constantFrom(...SEGMENTS), { maxLength: 3 }).map((dirs) => dirs), { minLength: 1, maxLength: 8, selector: (d) => d.join('/') }),
    shapes: fc.array(fc.tuple(fc.nat(7), fc.nat(6), fc.nat(20), fc.nat(9)), { minLength: 1, maxLength: 20 }),
    calls: fc.array(fc.tuple(fc.nat(), fc.nat(), fc.integer({ min: 1, max: 4 })), { maxLength: 25 }),
    imports: fc.array(fc.tuple(fc.nat(), fc.nat()), { maxLength: 10 }),
    packages: fc.subarray(['src', 'src/orders', 'lib', 'lib/ui/billing']),
    depth: fc.integer({ min: 1, max: 3 }),
  })
  .map(({ files, shapes, calls, imports, packages, depth }) => {
    const paths = files.map((dirs, k) => [...dirs, `f${k}.ts`].join('/'));
    const functions: FunctionRecord[] = paths.map((f) => topLevel(f, 1));
    shapes.forEach(([file, decisions, line, iv], k) => {
      const v = decisions + 1;
      functions.push(unit(paths[file % paths.length], `u${k}`, { decisions, iv: 1 + (iv % v), line: 2 + line, endLine: 2 + line + decisions, loc: 1 + decisions }));
    });
    return input({
      functions,
      calls: calls.map(([a, b, count]) => call(functions[a % functions.length], functions[b % functions.length], count)),
      imports: imports.map(([a, b]) => ({ from: paths[a % paths.length], to: paths[b % paths.length] })),
      packages: packages.map((p) => ({ path: p, name: p })),
      settings: { folderDepth: depth },
    });
  });

const sum = (modules: ModuleRecord[], key: 'functions' | 'cyclomatic' | 'decisions' | 'designComplexity' | 'lines' | 'fanIn' | 'fanOut'): number =>
  modules.reduce((s, m) => s + m[key], 0);

const levels = (modules: ModuleRecord[]): Map<ModuleLevel, ModuleRecord[]> => {
  const by = new Map<ModuleLevel, ModuleRecord[]>();
  for (const m of modules) by.set(m.level, [...(by.get(m.level) ?? []), m]);
  return by;
};

describe('buildModuleMap: properties on generated codebases', () => {
  it('should partition the codebase at every level: ΣV, Σ decisions, P, S0 and lines add up to the whole', () => {
    fc.assert(
      fc.property(codebase, (given) => {
        const { modules } = buildModuleMap(given);
        const whole = {
          functions: given.functions.length,
          cyclomatic: given.functions.reduce((s, f) => s + f.cyclomatic, 0),
          decisions: given.functions.reduce((s, f) => s + f.decisions, 0),
          designComplexity: given.functions.reduce((s, f) => s + f.designComplexity!, 0),
        };
        const byLevel = levels(modules);
        const fileLines = sum(byLevel.get('file')!, 'lines');
        for (const [, members] of byLevel) {
          // Additivity of v over disjoint graphs (McCabe 1976, reference-checks §9.3): any partition keeps ΣV.
          expect({ functions: sum(members, 'functions'), cyclomatic: sum(members, 'cyclomatic'), decisions: sum(members, 'decisions'), designComplexity: sum(members, 'designComplexity') }).toEqual(whole);
          expect(sum(members, 'lines')).toBe(fileLines);
          // Every call site that crosses a border leaves one module and enters another.
          expect(sum(members, 'fanIn')).toBe(sum(members, 'fanOut'));
          for (const m of members) {
            // S1 = S0 − n + 1 ≥ 1 because every iv ≥ 1 (NIST SP 500-235 §7.5; reference-checks §9.5).
            expect(m.integrationComplexity).toBe(integrationComplexity(m.designComplexity, m.functions));
            expect(m.integrationComplexity).toBeGreaterThanOrEqual(1);
            expect(m.cyclomatic).toBe(m.decisions + m.functions);
          }
        }
      }),
      { numRuns: 400 },
    );
  });

  it('should make Ca, Ce and fan-in/out agree with the module edges, and I lie in [0, 1]', () => {
    fc.assert(
      fc.property(codebase, (given) => {
        const { modules, moduleEdges } = buildModuleMap(given);
        for (const m of modules) {
          const out = moduleEdges.filter((e) => e.from === m.id);
          const into = moduleEdges.filter((e) => e.to === m.id);
          expect([m.ce, m.ca]).toEqual([out.length, into.length]);
          expect([m.fanOut, m.fanIn]).toEqual([out.reduce((s, e) => s + e.calls, 0), into.reduce((s, e) => s + e.calls, 0)]);
          if (m.ca + m.ce === 0) expect(m.instability).toBeNull();
          else expect(m.instability).toBe(m.ce / (m.ca + m.ce));
        }
        for (const e of moduleEdges) {
          expect(e.from).not.toBe(e.to);
          expect(e.weight).toBe(e.calls + e.imports);
        }
      }),
      { numRuns: 300 },
    );
  });

  it('should make each folder module the sum of its file modules', () => {
    fc.assert(
      fc.property(codebase, (given) => {
        const { modules } = buildModuleMap(given);
        const byLevel = levels(modules);
        // In a package, folders count from the package's own folder.
        const packages = new PackageLocator(given.packages.map((p) => p.path).filter((p) => p !== '.'));
        for (const folder of byLevel.get('folder')!) {
          const files = byLevel.get('file')!.filter((f) => `folder:${folderOf(f.path, given.settings.folderDepth, packages.packageOf(f.path))}` === folder.id);
          for (const key of ['functions', 'cyclomatic', 'decisions', 'designComplexity', 'lines'] as const) expect(folder[key]).toBe(sum(files, key));
          expect(folder.fanIn).toBeLessThanOrEqual(sum(files, 'fanIn'));
          expect(folder.maxCyclomatic).toBe(Math.max(...files.map((f) => f.maxCyclomatic)));
        }
      }),
      { numRuns: 300 },
    );
  });

  it('should show extracting a function as ΣV + 1 with Σ decisions unchanged, at every level', () => {
    fc.assert(
      fc.property(codebase, fc.nat(), (given, pick) => {
        const caller = given.functions[pick % given.functions.length];
        // Extract Method: the new function has V = 1 and no decision; its caller calls it once.
        const extracted = unit(caller.file, 'extracted', { line: caller.line, endLine: caller.line, loc: 1 });
        const after = { ...given, functions: [...given.functions, extracted], calls: [...given.calls, call(caller, extracted)] };
        const before = levels(buildModuleMap(given).modules);
        for (const [level, members] of levels(buildModuleMap(after).modules)) {
          const old = before.get(level)!;
          expect(sum(members, 'decisions') - sum(old, 'decisions')).toBe(0);
          expect(sum(members, 'cyclomatic') - sum(old, 'cyclomatic')).toBe(1);
          expect(sum(members, 'functions') - sum(old, 'functions')).toBe(1);
        }
      }),
      { numRuns: 300 },
    );
  });

  it('should give the same map for the same input in any order', () => {
    fc.assert(
      fc.property(codebase, (given) => {
        const reversed = { ...given, functions: [...given.functions].reverse(), calls: [...given.calls].reverse(), imports: [...given.imports].reverse() };
        expect(buildModuleMap(reversed)).toEqual(buildModuleMap(given));
      }),
      { numRuns: 200 },
    );
  });
});
