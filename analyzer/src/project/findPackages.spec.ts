import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { findPackages } from './findPackages';

const roots: string[] = [];

/** A temporary folder named `name` holding the given files. */
function tree(files: Record<string, string>, name = 'shop'): string {
  const root = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'seamline-packages-')), name);
  roots.push(path.dirname(root));
  for (const [file, text] of Object.entries(files)) {
    fs.mkdirSync(path.dirname(path.join(root, file)), { recursive: true });
    fs.writeFileSync(path.join(root, file), text);
  }
  fs.mkdirSync(root, { recursive: true });
  return root;
}

const manifest = (fields: Record<string, unknown>): string => JSON.stringify(fields);

afterAll(() => {
  for (const root of roots) fs.rmSync(root, { recursive: true, force: true });
});

describe('findPackages', () => {
  it('should read npm workspaces, with globs and negations, ignoring other package.json folders', () => {
    const root = tree({
      'package.json': manifest({ name: 'shop-monorepo', workspaces: ['packages/*', 'apps/**', '!packages/legacy'] }),
      'packages/orders/package.json': manifest({ name: '@shop/orders' }),
      'packages/billing/package.json': manifest({ name: '@shop/billing' }),
      'packages/legacy/package.json': manifest({ name: '@shop/legacy' }),
      'packages/orders/node_modules/dep/package.json': manifest({ name: 'dep' }),
      'apps/web/admin/package.json': manifest({ name: 'admin' }),
      'test/fixtures/sample/package.json': manifest({ name: 'sample' }),
    });
    expect(findPackages(root)).toEqual([
      { path: '.', name: 'shop-monorepo' },
      { path: 'apps/web/admin', name: 'admin' },
      { path: 'packages/billing', name: '@shop/billing' },
      { path: 'packages/orders', name: '@shop/orders' },
    ]);
  });

  it('should read the `packages` form of workspaces', () => {
    const root = tree({
      'package.json': manifest({ workspaces: { packages: ['libs/*'] } }),
      'libs/core/package.json': manifest({ name: 'core' }),
      'tools/package.json': manifest({ name: 'tools' }),
    });
    expect(findPackages(root)).toEqual([{ path: '.', name: 'shop' }, { path: 'libs/core', name: 'core' }]);
  });

  it('should take TypeScript project references when no workspaces are declared', () => {
    const root = tree({
      'tsconfig.json': '{\n  // solution file\n  "files": [],\n  "references": [{ "path": "./server" }, { "path": "client/tsconfig.app.json" }, { "path": "../outside" }],\n}\n',
      'server/tsconfig.json': '{}',
      'server/package.json': manifest({ name: 'shop-server' }),
      'client/tsconfig.app.json': '{}',
      'scripts/package.json': manifest({ name: 'scripts' }),
    });
    expect(findPackages(root)).toEqual([
      { path: '.', name: 'shop' },
      { path: 'client', name: 'client' },
      { path: 'server', name: 'shop-server' },
    ]);
  });

  it('should find nested package.json folders when nothing is declared, skipping node_modules and dot folders', () => {
    const root = tree({
      'package.json': '{ not json',
      'services/orders/package.json': manifest({ name: 'orders' }),
      'services/orders/lib/inner/package.json': manifest({}),
      'node_modules/x/package.json': manifest({ name: 'x' }),
      '.cache/y/package.json': manifest({ name: 'y' }),
    });
    expect(findPackages(root)).toEqual([
      { path: '.', name: 'shop' },
      { path: 'services/orders', name: 'orders' },
      { path: 'services/orders/lib/inner', name: 'inner' },
    ]);
  });

  it('should find no package in a single-package codebase or an empty folder', () => {
    expect(findPackages(tree({ 'package.json': manifest({ name: 'shop' }), 'src/a.ts': 'export {};' }))).toEqual([]);
    expect(findPackages(tree({}))).toEqual([]);
  });
});
