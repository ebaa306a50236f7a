import { matchModules, suggestModules } from './module-search';
import { moduleRecord } from './module-graph.fixtures';

const modules = [
  moduleRecord('src/dispatch-core', { cyclomatic: 300 }),
  moduleRecord('test/dispatch-core', { cyclomatic: 8 }),
  moduleRecord('src/routing', { cyclomatic: 100 }),
  moduleRecord('packages/core', { name: '@otterbay/core', cyclomatic: 50 }),
];

describe('module search', () => {
  it('should keep every module, in order, without a query or filter', () => {
    expect(matchModules(modules, '  ', 0)).toBe(modules);
  });

  it('should match any part of the path or name, ignoring case', () => {
    expect(matchModules(modules, 'DISPATCH', 0).map((m) => m.path)).toEqual(['src/dispatch-core', 'test/dispatch-core']);
    expect(matchModules(modules, '@otterbay', 0).map((m) => m.path)).toEqual(['packages/core']);
  });

  it('should apply the ΣV filter but keep the selected module', () => {
    expect(matchModules(modules, 'dispatch', 10).map((m) => m.path)).toEqual(['src/dispatch-core']);
    expect(matchModules(modules, 'dispatch', 10, 'folder:test/dispatch-core')).toHaveLength(2);
  });

  it('should suggest modules whose last segment starts with the query first, up to the limit', () => {
    const matches = matchModules(modules, 'core', 0);
    expect(suggestModules(matches, 'core', 10).map((m) => m.path)).toEqual([
      'packages/core',
      'src/dispatch-core',
      'test/dispatch-core',
    ]);
    expect(suggestModules(matches, 'core', 1)).toHaveLength(1);
    expect(suggestModules(matches, '', 10)).toEqual([]);
  });
});
