/**
 * The program calls are resolved on
 * ==================================
 * Builds one TypeScript program (ts-morph's TypeScript) over the scanned files so that the type
 * checker can resolve calls across the whole codebase. Reads the tsconfig's compiler options
 * when there is one, or sensible defaults; the root names are exactly the scanned files.
 * Nothing is emitted, executed or installed.
 *
 * Edge cases:
 * - Declaration files in node_modules (and `@types`) are loaded for type information, never
 *   JavaScript from node_modules (`maxNodeModuleJsDepth: 0`); only the scanned files are
 *   analysed as units by the caller.
 * - A package that ships JavaScript beside its `.d.ts` files (typeorm's build, say): an import
 *   that resolves to a `.d.ts` next to a scanned `.js` file is sent to the scanned file, so calls
 *   land on its functions instead of on the declarations.
 * - ts-morph keeps TypeScript's lib files in memory, not on disk: they are read through it, and
 *   parsed once per process (they never change).
 * - A file the parser cannot get through (a stack overflow on very deeply nested code) is left
 *   out of the program and listed in `unreadable`; the program is built from the others.
 * - Project references are not followed as such: imports resolve the way the module resolution
 *   options say (paths, node_modules), which reaches sources in a monorepo when they are linked.
 *
 * [Reference]: TypeScript compiler API, `ts.createProgram` / `CompilerHost` (common practice).
 */
import * as fs from 'node:fs';
import * as path from 'node:path';
import { Project } from 'ts-morph';
import { ts } from '../compiler';
import { ScanInputError } from './ScanInputError';

/** What the program is built from. */
export interface ProgramInput {
  /** The scanned folder. */
  root: string;
  /** The scanned files: posix paths relative to the root. */
  files: string[];
  /** A tsconfig whose compiler options to use (default: `<root>/tsconfig.json` when present). */
  tsconfig?: string;
}

/** Options used when the codebase has no tsconfig. */
export const DEFAULT_COMPILER_OPTIONS: Readonly<ts.CompilerOptions> = Object.freeze({
  target: ts.ScriptTarget.ESNext,
  module: ts.ModuleKind.ESNext,
  moduleResolution: ts.ModuleResolutionKind.Bundler,
  jsx: ts.JsxEmit.Preserve,
  esModuleInterop: true,
  experimentalDecorators: true,
});

// Whatever the tsconfig says: read JavaScript, never report on it, never emit, skip lib checks.
const FORCED_OPTIONS: Readonly<ts.CompilerOptions> = Object.freeze({
  allowJs: true,
  checkJs: false,
  noEmit: true,
  skipLibCheck: true,
  maxNodeModuleJsDepth: 0,
  noResolve: false,
  declaration: false,
  composite: false,
  incremental: false,
});

// Where ts-morph serves its in-memory lib files from.
const LIB_FOLDER = '/node_modules/typescript/lib';
const DECLARATION = /\.d\.([cm]?)ts$/i;

let libReader: ts.ModuleResolutionHost | undefined;
const libFiles = new Map<string, ts.SourceFile>();

/** Posix absolute path of a scanned file, as the program names it. */
export function programFileName(root: string, file: string): string {
  return toPosix(path.resolve(root, file));
}

/** The compiler options the call graph uses for this codebase. */
export function compilerOptionsFor(root: string, tsconfig?: string): ts.CompilerOptions {
  const configPath = tsconfig ? path.resolve(tsconfig) : path.join(root, 'tsconfig.json');
  if (!tsconfig && !fs.existsSync(configPath)) return { ...DEFAULT_COMPILER_OPTIONS, ...FORCED_OPTIONS };
  const read = ts.readConfigFile(configPath, (p) => fs.readFileSync(p, 'utf8'));
  if (read.error) throw new ScanInputError(`Cannot read ${configPath}: ${ts.flattenDiagnosticMessageText(read.error.messageText, ' ')}`);
  const parsed = ts.parseJsonConfigFileContent(read.config, ts.sys, path.dirname(configPath), undefined, configPath);
  // TS18003 "No inputs were found": the file list comes from the scan, only the options matter.
  const errors = parsed.errors.filter((e) => e.code !== 18003);
  if (errors.length) throw new ScanInputError(`Invalid ${configPath}: ${ts.flattenDiagnosticMessageText(errors[0].messageText, ' ')}`);
  return { ...parsed.options, ...FORCED_OPTIONS };
}

/** The program, and the files that could not be parsed into it. */
export interface CreatedProgram {
  program: ts.Program;
  /** Program file name (posix, absolute) → why it is missing, e.g. the parser ran out of stack. */
  unreadable: Map<string, string>;
}

/** One program over the scanned files, ready for `getTypeChecker()`. */
export function createProgram(input: ProgramInput): CreatedProgram {
  const root = path.resolve(input.root);
  const options = compilerOptionsFor(root, input.tsconfig);
  const rootNames = input.files.map((f) => programFileName(root, f));
  const unreadable = new Map<string, string>();
  const host = createHost(options, new Set(rootNames), unreadable);
  return { program: ts.createProgram({ rootNames, options, host }), unreadable };
}

function createHost(options: ts.CompilerOptions, scanned: Set<string>, unreadable: Map<string, string>): ts.CompilerHost {
  const host = ts.createCompilerHost(options, true);
  // JSDoc carries types only in JavaScript; TypeScript files parse faster without it.
  host.jsDocParsingMode = ts.JSDocParsingMode.ParseForTypeInfo;
  const lib = libHost();
  const isLib = (fileName: string) => fileName.startsWith(`${LIB_FOLDER}/`);
  const { getSourceFile, fileExists, readFile } = host;
  host.getDefaultLibLocation = () => LIB_FOLDER;
  host.getDefaultLibFileName = (o) => `${LIB_FOLDER}/${ts.getDefaultLibFileName(o)}`;
  host.fileExists = (fileName) => (isLib(fileName) ? lib.fileExists(fileName) : fileExists.call(host, fileName));
  host.readFile = (fileName) => (isLib(fileName) ? lib.readFile(fileName) : readFile.call(host, fileName));
  host.getSourceFile = (fileName, languageVersion, onError, shouldCreate) => {
    if (!isLib(fileName)) {
      try {
        return getSourceFile.call(host, fileName, languageVersion, onError, shouldCreate);
      } catch (err) {
        // Very deeply nested code exhausts the parser's stack: the file stays out, the others go on.
        unreadable.set(fileName, err instanceof Error ? `${err.name}: ${err.message}` : String(err));
        return undefined;
      }
    }
    const version = typeof languageVersion === 'object' ? languageVersion.languageVersion : languageVersion;
    const key = `${fileName}\0${version}`;
    let file = libFiles.get(key);
    const text = file ? undefined : lib.readFile(fileName);
    if (!file && text !== undefined) {
      file = ts.createSourceFile(fileName, text, languageVersion);
      libFiles.set(key, file);
    }
    return file;
  };
  const cache = ts.createModuleResolutionCache(host.getCurrentDirectory(), (f) => host.getCanonicalFileName(f), options);
  host.getModuleResolutionCache = () => cache;
  host.resolveModuleNameLiterals = (literals, containingFile, redirected, compilerOptions, containingSourceFile) =>
    literals.map((literal) => {
      const mode = ts.getModeForUsageLocation(containingSourceFile, literal, compilerOptions);
      const resolved = ts.resolveModuleName(literal.text, containingFile, compilerOptions, host, cache, redirected, mode);
      return preferScanned(resolved, scanned);
    });
  return host;
}

/** Sends an import that reached a `.d.ts` beside a scanned JavaScript file to that file. */
function preferScanned(resolved: ts.ResolvedModuleWithFailedLookupLocations, scanned: Set<string>): ts.ResolvedModuleWithFailedLookupLocations {
  const module = resolved.resolvedModule;
  if (!module) return resolved;
  if (scanned.has(module.resolvedFileName)) {
    return module.isExternalLibraryImport ? { ...resolved, resolvedModule: { ...module, isExternalLibraryImport: false } } : resolved;
  }
  const declaration = DECLARATION.exec(module.resolvedFileName);
  if (!declaration) return resolved;
  const stem = module.resolvedFileName.slice(0, declaration.index);
  const flavour = declaration[1].toLowerCase();
  const candidates = flavour === 'm' ? ['.mjs'] : flavour === 'c' ? ['.cjs'] : ['.js', '.jsx'];
  for (const extension of candidates) {
    const fileName = stem + extension;
    if (!scanned.has(fileName)) continue;
    const ext = extension === '.mjs' ? ts.Extension.Mjs : extension === '.cjs' ? ts.Extension.Cjs : extension === '.jsx' ? ts.Extension.Jsx : ts.Extension.Js;
    return { ...resolved, resolvedModule: { resolvedFileName: fileName, extension: ext, isExternalLibraryImport: false, resolvedUsingTsExtension: false } };
  }
  return resolved;
}

function libHost(): ts.ModuleResolutionHost {
  libReader ??= new Project({ skipAddingFilesFromTsConfig: true, skipFileDependencyResolution: true }).getModuleResolutionHost();
  return libReader;
}

function toPosix(p: string): string {
  return p.split(path.sep).join('/');
}
