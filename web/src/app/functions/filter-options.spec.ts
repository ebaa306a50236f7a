import { clusterLabel, moduleGroups, moduleIdLabel, moduleLabel } from './filter-options';
import type { ModuleOption } from './functions-types';

const modules: ModuleOption[] = [
  { id: 'folder:src/orders', level: 'folder', path: 'src/orders', functions: 9 },
  { id: 'folder:src/billing', level: 'folder', path: 'src/billing', functions: 5 },
  { id: 'file:src/orders/Order.ts', level: 'file', path: 'src/orders/Order.ts', functions: 4 },
  { id: 'file:src/orders/amend.ts', level: 'file', path: 'src/orders/amend.ts', functions: 2 },
];

describe('module suggestions', () => {
  it('should group matches by level and match any case', () => {
    expect(moduleGroups(modules, 'ORDER')).toEqual([
      { level: 'folder', label: 'Folders', modules: [modules[0]] },
      { level: 'file', label: 'Files', modules: [modules[2], modules[3]] },
    ]);
  });

  it('should offer everything for empty text, capped per level', () => {
    const groups = moduleGroups(modules, '  ', 1);
    expect(groups.map((g) => g.modules.map((m) => m.id))).toEqual([['folder:src/orders'], ['file:src/orders/Order.ts']]);
  });

  it('should name modules by level and path', () => {
    expect(moduleLabel(modules[0])).toBe('folder src/orders');
    expect(moduleIdLabel('file:src/a:b.ts')).toBe('file src/a:b.ts');
    expect(moduleIdLabel('odd')).toBe('odd');
  });
});

describe('clusterLabel', () => {
  it('should name the folder most of its files sit in', () => {
    const label = clusterLabel({
      id: 'c2',
      members: ['file:src/orders/a.ts', 'file:src/billing/b.ts', 'file:src/orders/c.ts', 'file:index.ts'],
      functions: 1234,
      cyclomatic: 3000,
    });
    expect(label).toBe('c2 · mostly src/orders · 1,234 functions');
  });

  it('should break ties by folder name and handle one function and root files', () => {
    expect(clusterLabel({ id: 'c9', members: ['file:z/a.ts', 'file:b/a.ts'], functions: 1, cyclomatic: 1 })).toBe(
      'c9 · mostly b · 1 function',
    );
    expect(clusterLabel({ id: 'c3', members: ['file:main.ts'], functions: 2, cyclomatic: 2 })).toBe('c3 · mostly (root) · 2 functions');
  });
});
