import { ts as tsMorphCompiler } from 'ts-morph';
import { ts } from './compiler';

describe('compiler', () => {
  it('is the very module ts-morph wraps as its `ts`, so syntax kinds and nodes agree between the two', () => {
    // ts-morph hands out a frozen namespace over the module, with the module itself as `default`.
    expect((tsMorphCompiler as unknown as { default: unknown }).default).toBe(ts);
    expect(tsMorphCompiler.forEachChild).toBe(ts.forEachChild);
    expect(tsMorphCompiler.SyntaxKind).toBe(ts.SyntaxKind);
    expect(tsMorphCompiler.version).toBe(ts.version);
  });

  it('parses', () => {
    const sourceFile = ts.createSourceFile('a.ts', 'const a = 1;', ts.ScriptTarget.Latest, true);
    expect(tsMorphCompiler.isVariableStatement(sourceFile.statements[0])).toBe(true);
  });
});
