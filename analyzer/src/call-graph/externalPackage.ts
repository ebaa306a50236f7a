/**
 * External package of a declaration file
 * ======================================
 * Names the group a call outside the scanned code is counted under: the npm package a file
 * belongs to (`node_modules/<name>` or `node_modules/@scope/name`, the innermost node_modules
 * folder winning), TypeScript's standard library, or otherwise the declaring file's own path.
 *
 * Edge cases: type packages count for the package they describe (`@types/node` → `node`,
 * `@types/babel__core` → `@babel/core`), since that is the code the call runs.
 *
 * [Reference]: npm package folder layout and DefinitelyTyped's `@types` naming (common practice).
 */

/** The group of calls into TypeScript's standard library (lib.*.d.ts: `console.log`, `Array.prototype.map`…). */
export const STANDARD_LIBRARY = 'typescript-lib';

const NODE_MODULES = '/node_modules/';

/** The package `fileName` (posix, absolute) belongs to, or undefined when it is in no node_modules folder. */
export function packageOfFile(fileName: string): string | undefined {
  const at = fileName.lastIndexOf(NODE_MODULES);
  if (at < 0) return undefined;
  const parts = fileName.slice(at + NODE_MODULES.length).split('/');
  const name = parts[0].startsWith('@') && parts.length > 1 ? `${parts[0]}/${parts[1]}` : parts[0];
  if (!name.startsWith('@types/')) return name;
  const described = name.slice('@types/'.length);
  const scoped = described.indexOf('__');
  return scoped > 0 ? `@${described.slice(0, scoped)}/${described.slice(scoped + 2)}` : described;
}
