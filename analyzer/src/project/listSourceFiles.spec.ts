import * as fs from 'node:fs';
import * as path from 'node:path';
import { tempTree as tree } from '../testing/tempTree';
import { listSourceFiles } from './listSourceFiles';
import { ScanInputError } from './ScanInputError';


describe('listSourceFiles', () => {
  it('should walk the folder when there is no tsconfig, skipping declarations and node_modules with a reason', () => {
    const root = tree({ 'src/a.ts': '', 'src/b.jsx': '', 'src/types.d.ts': '', 'node_modules/x/index.js': '', 'README.md': '', '.git/hooks/x.js': '' });
    fs.symlinkSync(path.join(root, 'src'), path.join(root, 'loop'));
    const listed = listSourceFiles(root);
    expect(listed.files).toEqual(['src/a.ts', 'src/b.jsx']);
    expect(listed.skipped).toEqual([
      { file: 'node_modules/', reason: 'node_modules' },
      { file: 'src/types.d.ts', reason: 'declaration' },
    ]);
  });

  it("should take the file list from the folder's tsconfig", () => {
    const root = tree({ 'tsconfig.json': '{ "include": ["src"], "exclude": ["src/legacy"] }', 'src/a.ts': '', 'src/legacy/old.ts': '', 'scripts/x.ts': '' });
    expect(listSourceFiles(root)).toMatchObject({ files: ['src/a.ts'], tsconfig: 'tsconfig.json' });
  });

  it('should say clearly what is wrong with the input', () => {
    expect(() => listSourceFiles('/nonexistent/folder')).toThrow(new ScanInputError('No such folder: /nonexistent/folder'));
    const root = tree({ 'a.ts': '', 'tsconfig.json': '{ "compilerOptions": { "target": ' });
    expect(() => listSourceFiles(root)).toThrow(/Cannot read .*tsconfig\.json|Invalid .*tsconfig\.json/);
    expect(() => listSourceFiles(root, path.join(root, 'missing.json'))).toThrow(/No such tsconfig/);
    expect(() => listSourceFiles(path.join(root, 'a.ts'))).toThrow(/Not a folder/);
  });
});
