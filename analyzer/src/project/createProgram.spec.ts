import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { ts } from 'ts-morph';
import { compilerOptionsFor, createProgram, DEFAULT_COMPILER_OPTIONS } from './createProgram';
import { ScanInputError } from './ScanInputError';

describe('createProgram', () => {
  let root: string;
  beforeEach(() => {
    root = fs.mkdtempSync(path.join(os.tmpdir(), 'seamline-program-'));
  });
  afterEach(() => fs.rmSync(root, { recursive: true, force: true }));

  const write = (file: string, text: string) => {
    fs.mkdirSync(path.dirname(path.join(root, file)), { recursive: true });
    fs.writeFileSync(path.join(root, file), text);
  };

  it('uses the defaults without a tsconfig, always reading JavaScript and never emitting', () => {
    const options = compilerOptionsFor(root);
    expect(options).toMatchObject({ ...DEFAULT_COMPILER_OPTIONS, allowJs: true, checkJs: false, noEmit: true, maxNodeModuleJsDepth: 0 });
  });

  it("takes the tsconfig's options (here a paths mapping) and resolves through them", () => {
    write('tsconfig.json', JSON.stringify({ compilerOptions: { module: 'preserve', moduleResolution: 'bundler', types: [], paths: { '@lib/*': ['./lib/*'] } } }));
    write('lib/a.ts', 'export const a = 1;\n');
    write('main.ts', "import { a } from '@lib/a';\nexport const b = a;\n");
    const { program } = createProgram({ root, files: ['lib/a.ts', 'main.ts'] });
    expect(program.getCompilerOptions().paths).toEqual({ '@lib/*': ['./lib/*'] });
    const main = program.getSourceFile(`${root.split(path.sep).join('/')}/main.ts`)!;
    const specifier = (main.statements[0] as ts.ImportDeclaration).moduleSpecifier;
    const target = program.getTypeChecker().getSymbolAtLocation(specifier)?.declarations?.[0];
    expect(target && ts.isSourceFile(target) ? path.basename(target.fileName) : undefined).toBe('a.ts');
  });

  it("loads TypeScript's standard library from ts-morph (Math.max resolves into a default lib file)", () => {
    write('main.ts', 'export const m = Math.max(1, 2);\n');
    const { program } = createProgram({ root, files: ['main.ts'] });
    const main = program.getSourceFile(`${root.split(path.sep).join('/')}/main.ts`)!;
    let call: ts.CallExpression | undefined;
    const find = (node: ts.Node): void => {
      if (ts.isCallExpression(node)) call = node;
      else ts.forEachChild(node, find);
    };
    find(main);
    const declaration = program.getTypeChecker().getResolvedSignature(call!)?.declaration;
    expect(declaration && program.isSourceFileDefaultLibrary(declaration.getSourceFile())).toBe(true);
  });

  it('refuses an invalid tsconfig with a clear error', () => {
    write('tsconfig.json', '{ "compilerOptions": { "target": 42 } }');
    expect(() => createProgram({ root, files: [] })).toThrow(ScanInputError);
    expect(() => createProgram({ root, files: [], tsconfig: path.join(root, 'missing.json') })).toThrow(/Cannot read/);
  });

  it('leaves out a file the parser cannot get through and says why', () => {
    write('ok.ts', 'export const x = 1;\n');
    write('deep.ts', `export const v = ${'['.repeat(50000)}${']'.repeat(50000)};\n`);
    const { program, unreadable } = createProgram({ root, files: ['deep.ts', 'ok.ts'] });
    const posixRoot = root.split(path.sep).join('/');
    expect(program.getSourceFile(`${posixRoot}/ok.ts`)).toBeDefined();
    expect(program.getSourceFile(`${posixRoot}/deep.ts`)).toBeUndefined();
    expect(unreadable.get(`${posixRoot}/deep.ts`)).toMatch(/Maximum call stack/);
  });
});
