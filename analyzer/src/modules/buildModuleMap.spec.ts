import { analyzeSource } from '../analyzeSource';
import { DEFAULT_SETTINGS, type ModuleRecord } from '../model';
import { buildModuleMap } from './buildModuleMap';
import { call, input, topLevel, unit } from './fixtures/records';
import { ModuleMapError } from './ModuleMapError';

const find = (modules: ModuleRecord[], id: string): ModuleRecord => {
  const m = modules.find((x) => x.id === id);
  if (!m) throw new Error(`no module ${id} among ${modules.map((x) => x.id).join(', ')}`);
  return m;
};

describe('buildModuleMap: Martin package metrics (reference-checks §6)', () => {
  it('should give the worked package Ca = 6, Ce = 2, I = 0.25, A = 1/3', () => {
    // reference-checks 6.1 (DERIVED from Martin 2002): 3 classes, 1 an interface; 6 outside classes
    // depend on P; P's classes use 2 outside classes. Each outside class sits in its own folder,
    // so counting modules (our unit) and counting classes give the same numbers here.
    const inP = ['p/order.ts', 'p/invoice.ts', 'p/priced.ts'].map((f) => unit(f, 'use'));
    const users = [1, 2, 3, 4, 5, 6].map((k) => unit(`c${k}/user.ts`, 'run'));
    const used = [unit('d1/tax.ts', 'rate'), unit('d2/money.ts', 'round')];
    const functions = [...inP, ...users, ...used, ...[...inP, ...users, ...used].map((f) => topLevel(f.file))];
    const calls = [
      ...users.map((u, k) => call(u, inP[k % 2])),
      call(inP[0], used[0], 3),
      call(inP[1], used[1]),
      call(inP[1], used[0]),
    ];
    const abstractness = new Map([
      ['p/order.ts', { abstract: 0, total: 1 }],
      ['p/invoice.ts', { abstract: 0, total: 1 }],
      ['p/priced.ts', { abstract: 1, total: 1 }],
    ]);
    const p = find(buildModuleMap(input({ functions, calls, abstractness })).modules, 'folder:p');
    expect([p.ca, p.ce, p.instability, p.abstractness]).toEqual([6, 2, 0.25, 1 / 3]);
    // D = |A + I − 1| (Martin 2002; reference-checks 6.1): 0.416667.
    expect(Math.abs(p.abstractness! + p.instability! - 1)).toBeCloseTo(0.416667, 6);
    expect([p.fanIn, p.fanOut]).toEqual([6, 5]);
  });

  it('should count imports as dependencies: 3 incoming and 1 outgoing give I = 1/4', () => {
    // Martin 2002, Stable Dependencies Principle example (from memory, reference-checks 6.3): I = 1/4.
    const files = ['core/a.ts', 'x/a.ts', 'y/a.ts', 'z/a.ts', 'base/a.ts'];
    const imports = [
      { from: 'x/a.ts', to: 'core/a.ts' },
      { from: 'y/a.ts', to: 'core/a.ts' },
      { from: 'z/a.ts', to: 'core/a.ts' },
      { from: 'z/a.ts', to: 'core/a.ts' },
      { from: 'core/a.ts', to: 'base/a.ts' },
    ];
    const { modules, moduleEdges } = buildModuleMap(input({ functions: files.map((f) => topLevel(f)), imports }));
    const core = find(modules, 'folder:core');
    expect([core.ca, core.ce, core.instability, core.fanIn]).toEqual([3, 1, 0.25, 0]);
    // The repeated import z → core counts once.
    expect(moduleEdges.find((e) => e.from === 'folder:z' && e.to === 'folder:core')).toEqual({ level: 'folder', from: 'folder:z', to: 'folder:core', weight: 1, calls: 0, imports: 1 });
  });

  it('should leave instability and abstractness empty (null) for an isolated module without classes', () => {
    // common practice (reference-checks 6.4): I of an isolated module is 0/0; our convention is null.
    const [m] = buildModuleMap(input({ functions: [topLevel('a.ts'), unit('a.ts', 'f', { decisions: 2 })] })).modules;
    expect([m.ca, m.ce, m.instability, m.abstractness]).toEqual([0, 0, null, null]);
  });
});

describe('buildModuleMap: levels, sums and edges', () => {
  const functions = [
    topLevel('src/orders/route.ts', 2),
    unit('src/orders/route.ts', 'route', { decisions: 12, iv: 3, line: 2, endLine: 20, loc: 15 }),
    unit('src/orders/route.ts', 'pick', { decisions: 1, iv: 2, line: 21, endLine: 25, loc: 5 }),
    topLevel('src/billing/bill.ts', 1),
    unit('src/billing/bill.ts', 'bill', { decisions: 3, iv: 1, line: 2, endLine: 9, loc: 8 }),
    topLevel('main.ts', 4),
    unit('packages/ui/src/view.ts', 'render', { line: 1, endLine: 3, loc: 3 }),
    topLevel('packages/ui/src/view.ts'),
  ];
  const [, route, pick, , bill, main, render] = functions;
  const map = buildModuleMap(
    input({
      functions,
      calls: [call(route, bill, 2), call(pick, bill), call(main, route), call(render, route, 4), call(route, pick, 7)],
      imports: [{ from: 'src/orders/route.ts', to: 'src/billing/bill.ts' }, { from: 'main.ts', to: 'src/orders/route.ts' }, { from: 'main.ts', to: 'skipped.ts' }],
      packages: [{ path: '.', name: 'shop' }, { path: 'packages/ui', name: '@shop/ui' }],
      settings: { folderDepth: 2 },
    }),
  );

  it('should list modules by level, then path', () => {
    expect(map.modules.map((m) => m.id)).toEqual([
      'file:main.ts', 'file:packages/ui/src/view.ts', 'file:src/billing/bill.ts', 'file:src/orders/route.ts',
      // In a package, folders count from the package's folder: view.ts sits in packages/ui/src.
      'folder:.', 'folder:packages/ui/src', 'folder:src/billing', 'folder:src/orders',
      'package:.', 'package:packages/ui',
    ]);
    expect(find(map.modules, 'package:packages/ui').name).toBe('@shop/ui');
    expect(find(map.modules, 'package:.').name).toBe('shop');
  });

  it('should sum P, ΣV, Σ decisions, lines, S0 and S1 per module', () => {
    const orders = find(map.modules, 'folder:src/orders');
    expect(orders).toMatchObject({ functions: 3, cyclomatic: 1 + 13 + 2, decisions: 13, maxCyclomatic: 13, overLimit: 1, lines: 2 + 15 + 5 });
    // S0 = Σ iv = 1 + 3 + 2; S1 = S0 − n + 1 (McCabe & Butler 1989).
    expect([orders.designComplexity, orders.integrationComplexity]).toEqual([6, 4]);
    expect(orders.nodes - orders.edges + orders.cyclomatic).toBe(2 * orders.functions);
  });

  it('should count call sites across the border as fan-in and fan-out, and calls plus imports as edges', () => {
    const orders = find(map.modules, 'folder:src/orders');
    // In: main → route (1) and render → route (4); out: route → bill (2), pick → bill (1). route → pick stays inside.
    expect([orders.fanIn, orders.fanOut, orders.ca, orders.ce]).toEqual([5, 3, 2, 1]);
    expect(map.moduleEdges.filter((e) => e.level === 'folder')).toEqual([
      { level: 'folder', from: 'folder:.', to: 'folder:src/orders', weight: 2, calls: 1, imports: 1 },
      { level: 'folder', from: 'folder:packages/ui/src', to: 'folder:src/orders', weight: 4, calls: 4, imports: 0 },
      { level: 'folder', from: 'folder:src/orders', to: 'folder:src/billing', weight: 4, calls: 3, imports: 1 },
    ]);
  });

  it('should put files outside every package into the root package', () => {
    const root = find(map.modules, 'package:.');
    expect(root.functions).toBe(6);
    expect(map.moduleEdges.filter((e) => e.level === 'package')).toEqual([
      { level: 'package', from: 'package:packages/ui', to: 'package:.', weight: 4, calls: 4, imports: 0 },
    ]);
  });

  it('should leave out the package level when no package was found', () => {
    const levels = new Set(buildModuleMap(input({ functions, packages: [] })).modules.map((m) => m.level));
    expect([...levels]).toEqual(['file', 'folder']);
    const rootOnly = buildModuleMap(input({ functions, packages: [{ path: '.', name: 'shop' }] })).modules;
    expect(rootOnly.some((m) => m.level === 'package')).toBe(false);
  });

  it('should take open calls from the call graph when given', () => {
    const perFunction = new Map([[route.id, { unresolvedCalls: 2, externalCalls: 5 }]]);
    const file = find(buildModuleMap(input({ functions, perFunction })).modules, 'file:src/orders/route.ts');
    expect([file.unresolvedCalls, file.externalCalls]).toEqual([2, 5]);
  });
});

describe('buildModuleMap: lines of code', () => {
  it.each([
    ['functions, methods and top-level code', 'import x from "x";\n\nexport function a(v) {\n  if (v) return 1;\n  return 2;\n}\nclass K {\n  m() {\n    return () => 3;\n  }\n}\nconst y = 1;\n'],
    ['units sharing a line', 'p.then(() => {\n  a();\n}, () => {\n  b();\n}).catch(() => 1); f(() => 2, () => 3);\n'],
    ['one-line units only', 'const f = () => 1; const g = () => 2;\n'],
  ])('should give a file module the file\'s code lines: %s', (_what, text) => {
    const analysis = analyzeSource('src/a.ts', text, DEFAULT_SETTINGS);
    const functions = analysis.functions.map((f) => ({ ...f, designComplexity: 1 }));
    const [file] = buildModuleMap(input({ functions })).modules;
    expect(file.lines).toBe(analysis.loc);
  });
});

describe('buildModuleMap: bad input', () => {
  const functions = [topLevel('a.ts'), unit('a.ts', 'f')];

  it('should refuse a folder depth below 1', () => {
    expect(() => buildModuleMap(input({ functions, settings: { folderDepth: 0 } }))).toThrow(ModuleMapError);
  });

  it('should refuse a call naming an unknown function', () => {
    expect(() => buildModuleMap(input({ functions, calls: [call(functions[1], unit('b.ts', 'g'))] }))).toThrow(/analyzer\/modules: call .* not among the records/);
  });

  it('should refuse records whose ΣV disagrees with E − N + 2P (a bug upstream)', () => {
    const broken = { ...unit('a.ts', 'g', { decisions: 2 }), nodes: 9 };
    expect(() => buildModuleMap(input({ functions: [...functions, broken] }))).toThrow(/ΣV\(strict\) = 5 but E − N \+ 2P/);
  });

  it('should refuse a function without iv(G)', () => {
    const { designComplexity: _, ...bare } = unit('a.ts', 'g');
    expect(() => buildModuleMap(input({ functions: [...functions, bare] }))).toThrow(/no designComplexity/);
  });
});
