/**
 * Which module a file belongs to
 * ==============================
 * - folder level: the first `folderDepth` segments of the file's folder (`src/orders/api/x.ts`
 *   at depth 2 is in `src/orders`); a file at the root is in the folder `.`; in a package, the
 *   segments count from the package's folder (`packages/billing/src/tax/vat.ts` at depth 2 is in
 *   `packages/billing/src/tax`), so that each package gets folders of its own;
 * - package level: the innermost package folder that contains the file; a file in no package
 *   is in the root package `.`.
 * Paths are posix and relative to the scanned root.
 */
import { ModuleMapError } from './ModuleMapError';

/** The folder module of a file at the given depth (≥ 1), counted from its package's folder when it has one. */
export function folderOf(file: string, folderDepth: number, packageFolder = '.'): string {
  if (packageFolder !== '.' && file.startsWith(`${packageFolder}/`)) {
    const inner = folderOf(file.slice(packageFolder.length + 1), folderDepth);
    return inner === '.' ? packageFolder : `${packageFolder}/${inner}`;
  }
  const segments = file.split('/');
  segments.pop();
  return segments.length === 0 ? '.' : segments.slice(0, folderDepth).join('/');
}

/** A package folder written as `.`, `pkg`, `./pkg/` or `pkg/` becomes `.` or `pkg`. */
export function normalizeFolder(folder: string): string {
  const trimmed = folder.replace(/^(\.\/)+/, '').replace(/\/+$/, '');
  return trimmed === '' ? '.' : trimmed;
}

/** Finds the innermost package folder containing a file. */
export class PackageLocator {
  private readonly folders: Set<string>;

  constructor(packagePaths: Iterable<string>) {
    this.folders = new Set([...packagePaths].map(normalizeFolder));
  }

  packageOf(file: string): string {
    for (let end = file.lastIndexOf('/'); end > 0; end = file.lastIndexOf('/', end - 1)) {
      const folder = file.slice(0, end);
      if (this.folders.has(folder)) return folder;
    }
    return '.';
  }
}

/** Checks the folder depth setting. */
export function checkFolderDepth(folderDepth: number): void {
  if (!Number.isInteger(folderDepth) || folderDepth < 1) {
    throw new ModuleMapError(`folderDepth must be a whole number of at least 1, not ${folderDepth}`);
  }
}
