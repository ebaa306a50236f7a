import * as fs from 'node:fs';
import * as path from 'node:path';
import { ts } from '../compiler';
import type { SkippedFile } from '../model';
import { ScanInputError } from './ScanInputError';

const SOURCE = /\.(ts|tsx|mts|cts|js|jsx|mjs|cjs)$/i;
const DECLARATION = /\.d\.[cm]?ts$/i;
const IGNORED_DIRS = new Set(['.git', '.hg', '.svn']);

export interface SourceList {
  /** Posix paths relative to the root, sorted. */
  files: string[];
  skipped: SkippedFile[];
  /** The tsconfig used, relative to the root, if any. */
  tsconfig?: string;
}

/**
 * The files to scan under `root`: those a tsconfig names (the given one, else `root/tsconfig.json`
 * when present), or every TypeScript/JavaScript file under the root. Declaration files and
 * anything in node_modules are skipped with a reason; symbolic links are not followed.
 */
export function listSourceFiles(root: string, tsconfig?: string): SourceList {
  let stat: fs.Stats;
  try {
    stat = fs.statSync(root);
  } catch {
    throw new ScanInputError(`No such folder: ${root}`);
  }
  if (!stat.isDirectory()) throw new ScanInputError(`Not a folder: ${root} (give the folder that holds the code)`);
  const configPath = tsconfig ? path.resolve(tsconfig) : path.join(root, 'tsconfig.json');
  if (tsconfig || fs.existsSync(configPath)) return fromTsconfig(root, configPath);
  return fromWalk(root);
}

function fromTsconfig(root: string, configPath: string): SourceList {
  if (!fs.existsSync(configPath)) throw new ScanInputError(`No such tsconfig: ${configPath}`);
  const read = ts.readConfigFile(configPath, (p) => fs.readFileSync(p, 'utf8'));
  if (read.error) throw new ScanInputError(`Cannot read ${configPath}: ${ts.flattenDiagnosticMessageText(read.error.messageText, ' ')}`);
  const parsed = ts.parseJsonConfigFileContent(read.config, ts.sys, path.dirname(configPath), undefined, configPath);
  // TS18003 "No inputs were found" is an empty project, not a broken config.
  const errors = parsed.errors.filter((e) => e.code !== 18003);
  if (errors.length) throw new ScanInputError(`Invalid ${configPath}: ${ts.flattenDiagnosticMessageText(errors[0].messageText, ' ')}`);
  const files: string[] = [];
  const skipped: SkippedFile[] = [];
  for (const absolute of parsed.fileNames) {
    const file = toPosix(path.relative(root, absolute));
    if (file.startsWith('../') || path.isAbsolute(file)) continue; // outside the scanned folder
    if (file.split('/').includes('node_modules')) skipped.push({ file, reason: 'node_modules' });
    else if (DECLARATION.test(file)) skipped.push({ file, reason: 'declaration' });
    else if (SOURCE.test(file)) files.push(file);
  }
  return { files: files.sort(), skipped, tsconfig: toPosix(path.relative(root, configPath)) };
}

function fromWalk(root: string): SourceList {
  const files: string[] = [];
  const skipped: SkippedFile[] = [];
  const pending = [''];
  while (pending.length > 0) {
    const dir = pending.pop()!;
    for (const entry of fs.readdirSync(path.join(root, dir), { withFileTypes: true })) {
      const rel = dir ? `${dir}/${entry.name}` : entry.name;
      if (entry.isSymbolicLink()) continue;
      if (entry.isDirectory()) {
        if (entry.name === 'node_modules') skipped.push({ file: `${rel}/`, reason: 'node_modules' });
        else if (!IGNORED_DIRS.has(entry.name)) pending.push(rel);
      } else if (entry.isFile() && SOURCE.test(entry.name)) {
        if (DECLARATION.test(entry.name)) skipped.push({ file: rel, reason: 'declaration' });
        else files.push(rel);
      }
    }
  }
  return { files: files.sort(), skipped: skipped.sort((a, b) => a.file.localeCompare(b.file)) };
}

function toPosix(p: string): string {
  return p.split(path.sep).join('/');
}
