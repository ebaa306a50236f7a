/**
 * Package folders of a codebase
 * =============================
 * Reads how the codebase declares its packages, in this order (the first that names any wins):
 * 1. npm workspaces in the root package.json (`"workspaces": [...]` or `{ "packages": [...] }`,
 *    with `*`, `**` and `!` patterns), matched against folders that hold a package.json;
 * 2. TypeScript project references in the root tsconfig.json (`"references": [{ "path" }]`,
 *    a folder or a tsconfig file inside the root);
 * 3. else every folder below the root with its own package.json.
 * node_modules, folders starting with a dot and symbolic links are never entered. Each
 * package's name is its package.json `name`, else the folder's name. When any package is
 * found, the root comes first as `{ path: '.', name }` (the root package.json's name, else the
 * root folder's name): the module map puts files outside every package there. A package.json
 * or tsconfig that cannot be read or parsed declares nothing; it never stops a scan.
 */
import * as fs from 'node:fs';
import * as path from 'node:path';
import { ts } from '../compiler';

/** A package: its folder (posix, relative to the root; `.` for the root) and name. */
export interface PackageFolder {
  path: string;
  name: string;
}

const SKIPPED_DIRS = new Set(['node_modules']);

/** The packages of the codebase at `root`, root first, then sorted by path; [] when there are none. */
export function findPackages(root: string): PackageFolder[] {
  const rootManifest = readJson(path.join(root, 'package.json'));
  const withManifest = foldersWithManifest(root);
  const patterns = workspacePatterns(rootManifest);
  let folders: string[];
  if (patterns.length > 0) folders = withManifest.filter((f) => matchesWorkspaces(f, patterns));
  else {
    const references = projectReferences(root);
    folders = references.length > 0 ? references : withManifest;
  }
  folders = [...new Set(folders)].filter((f) => f !== '.').sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
  if (folders.length === 0) return [];
  return [
    { path: '.', name: nameIn(rootManifest) ?? path.basename(path.resolve(root)) },
    ...folders.map((f) => ({ path: f, name: nameIn(readJson(path.join(root, f, 'package.json'))) ?? path.posix.basename(f) })),
  ];
}

/** Folders below the root (posix, relative) that hold a package.json. */
function foldersWithManifest(root: string): string[] {
  const found: string[] = [];
  const pending = [''];
  while (pending.length > 0) {
    const dir = pending.pop()!;
    let entries: fs.Dirent[];
    try {
      entries = fs.readdirSync(path.join(root, dir), { withFileTypes: true });
    } catch {
      continue; // an unreadable folder holds no package we can use
    }
    for (const entry of entries) {
      if (entry.isDirectory() && !SKIPPED_DIRS.has(entry.name) && !entry.name.startsWith('.')) {
        pending.push(dir ? `${dir}/${entry.name}` : entry.name);
      } else if (dir !== '' && entry.isFile() && entry.name === 'package.json') {
        found.push(dir);
      }
    }
  }
  return found;
}

function workspacePatterns(manifest: unknown): string[] {
  if (!isObject(manifest)) return [];
  const declared = Array.isArray(manifest.workspaces) ? manifest.workspaces : isObject(manifest.workspaces) ? manifest.workspaces.packages : undefined;
  return Array.isArray(declared) ? declared.filter((p): p is string => typeof p === 'string') : [];
}

function matchesWorkspaces(folder: string, patterns: string[]): boolean {
  let included = false;
  for (const pattern of patterns) {
    const negated = pattern.startsWith('!');
    if (globToRegExp(negated ? pattern.slice(1) : pattern).test(folder)) included = !negated;
  }
  return included;
}

/** `packages/*`, `apps/**`, `./libs/core/` as a regular expression over posix folder paths. */
function globToRegExp(glob: string): RegExp {
  const segments = glob.replace(/^(\.\/)+/, '').replace(/\/+$/, '').split('/');
  let source = '';
  let slash = false;
  for (const segment of segments) {
    if (segment === '**') {
      // Any number of folders, none included: `a/**` matches `a` too, `**/b` matches `b`.
      source += slash ? '(?:/[^/]+)*' : '(?:[^/]+/)*';
      continue;
    }
    source += (slash ? '/' : '') + segment.split('*').map(escapeRegExp).join('[^/]*');
    slash = true;
  }
  return new RegExp(`^${slash ? source : '.+'}$`);
}

function escapeRegExp(text: string): string {
  return text.replace(/[.+?^${}()|[\]\\]/g, '\\$&');
}

/** Folders (posix, relative, inside the root) that the root tsconfig.json references. */
function projectReferences(root: string): string[] {
  const configPath = path.join(root, 'tsconfig.json');
  if (!fs.existsSync(configPath)) return [];
  const read = ts.readConfigFile(configPath, (p) => fs.readFileSync(p, 'utf8'));
  const references: unknown = isObject(read.config) ? read.config.references : undefined;
  if (read.error || !Array.isArray(references)) return [];
  const folders: string[] = [];
  for (const ref of references) {
    if (!isObject(ref) || typeof ref.path !== 'string') continue;
    let target = path.resolve(root, ref.path);
    if (!isDirectory(target)) target = path.dirname(target);
    const rel = path.relative(path.resolve(root), target).split(path.sep).join('/');
    if (rel !== '' && !rel.startsWith('../') && rel !== '..' && !path.isAbsolute(rel)) folders.push(rel);
  }
  return folders;
}

function isDirectory(p: string): boolean {
  try {
    return fs.statSync(p).isDirectory();
  } catch {
    return false;
  }
}

function readJson(file: string): unknown {
  try {
    return JSON.parse(fs.readFileSync(file, 'utf8'));
  } catch {
    return undefined;
  }
}

function nameIn(manifest: unknown): string | undefined {
  return isObject(manifest) && typeof manifest.name === 'string' && manifest.name !== '' ? manifest.name : undefined;
}

function isObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}
