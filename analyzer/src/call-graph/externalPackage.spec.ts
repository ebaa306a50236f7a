import { packageOfFile } from './externalPackage';

// npm's folder layout and DefinitelyTyped's @types naming (common practice).
describe('packageOfFile', () => {
  it.each([
    ['/app/node_modules/lodash/index.d.ts', 'lodash'],
    ['/app/node_modules/@angular/core/index.d.ts', '@angular/core'],
    ['/app/node_modules/a/node_modules/b/lib/x.d.ts', 'b'],
    ['/app/node_modules/@types/node/fs.d.ts', 'node'],
    ['/app/node_modules/@types/babel__core/index.d.ts', '@babel/core'],
  ])('%s belongs to %s', (file, name) => {
    expect(packageOfFile(file)).toBe(name);
  });

  it('gives nothing for a file in no node_modules folder', () => {
    expect(packageOfFile('/app/src/types/globals.d.ts')).toBeUndefined();
  });
});
