import { moduleRecord } from './fixtures/moduleMapSnapshot';
import { moduleMembership } from './moduleMembership';

describe('moduleMembership', () => {
  it('should match files exactly at the file level', () => {
    const of = moduleMembership([moduleRecord('file', 'src/a.ts'), moduleRecord('folder', 'src')], 'file');
    expect([of('src/a.ts'), of('src/b.ts'), of('src')]).toEqual(['file:src/a.ts', undefined, undefined]);
  });

  it('should take the longest containing folder, never a folder that is only a name prefix', () => {
    const of = moduleMembership([moduleRecord('package', 'packages/core'), moduleRecord('package', 'packages/core/plugins/x'), moduleRecord('package', 'packages/cor')], 'package');
    expect(of('packages/core/src/a.ts')).toBe('package:packages/core');
    expect(of('packages/core/plugins/x/index.ts')).toBe('package:packages/core/plugins/x');
    expect(of('packages/core2/a.ts')).toBe(undefined);
    expect(of('packages/cor/a.ts')).toBe('package:packages/cor');
  });

  it('should let a root module take the files no other module claims', () => {
    const of = moduleMembership([moduleRecord('folder', '.'), moduleRecord('folder', 'src/orders')], 'folder');
    expect([of('index.ts'), of('src/orders/a.ts'), of('src/x.ts')]).toEqual(['folder:.', 'folder:src/orders', 'folder:.']);
  });
});
