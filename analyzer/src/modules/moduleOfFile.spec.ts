import { folderOf, normalizeFolder, PackageLocator } from './moduleOfFile';

describe('folderOf', () => {
  it.each([
    ['main.ts', 2, '.'],
    ['src/a.ts', 2, 'src'],
    ['src/orders/a.ts', 2, 'src/orders'],
    ['src/orders/api/deep/a.ts', 2, 'src/orders'],
    ['src/orders/api/a.ts', 1, 'src'],
  ])('should put %s at depth %i into %s', (file, depth, folder) => {
    expect(folderOf(file, depth)).toBe(folder);
  });

  it.each([
    ['packages/billing/src/tax/vat.ts', 2, 'packages/billing', 'packages/billing/src/tax'],
    ['packages/billing/src/money.ts', 2, 'packages/billing', 'packages/billing/src'],
    ['packages/billing/index.ts', 2, 'packages/billing', 'packages/billing'],
    ['src/orders/api/a.ts', 2, '.', 'src/orders'],
  ])('should count the folders of %s from its package (depth %i, package %s) into %s', (file, depth, pkg, folder) => {
    expect(folderOf(file, depth, pkg)).toBe(folder);
  });
});

describe('PackageLocator', () => {
  const locator = new PackageLocator(['packages/ui', './packages/ui/widgets/', 'apps/web']);

  it('should pick the innermost package folder holding the file', () => {
    expect(locator.packageOf('packages/ui/widgets/src/button.ts')).toBe('packages/ui/widgets');
    expect(locator.packageOf('packages/ui/src/view.ts')).toBe('packages/ui');
  });

  it('should put a file in no package, or in a folder merely named like one, into the root package', () => {
    expect(locator.packageOf('scripts/build.ts')).toBe('.');
    expect(locator.packageOf('apps/website/x.ts')).toBe('.');
    expect(locator.packageOf('main.ts')).toBe('.');
  });

  it('should normalise folder spellings', () => {
    expect(['./a/', 'a', '', './', 'a/b//'].map(normalizeFolder)).toEqual(['a', 'a', '.', '.', 'a/b']);
  });
});
