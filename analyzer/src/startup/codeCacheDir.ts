/**
 * Where the code cache lives
 * ==========================
 * `SEAMLINE_CODE_CACHE` names the folder, or turns the cache off (`off`, `0` or empty); by default
 * it is `seamline/code-cache` under the user's cache folder (`XDG_CACHE_HOME`, else ~/.cache).
 * Cached bytecode runs as code, so a folder that another user could write to, or a symbolic link,
 * is never used.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';

/** The folder to keep the code cache in, created if needed; undefined when off or unusable. */
export function codeCacheDir(env: NodeJS.ProcessEnv = process.env): string | undefined {
  const chosen = env['SEAMLINE_CODE_CACHE'];
  if (chosen !== undefined && ['', '0', 'off', 'false'].includes(chosen.trim().toLowerCase())) return undefined;
  try {
    const dir = chosen !== undefined ? path.resolve(chosen) : path.join(env['XDG_CACHE_HOME'] || path.join(os.homedir(), '.cache'), 'seamline', 'code-cache');
    fs.mkdirSync(dir, { recursive: true, mode: 0o700 });
    return isPrivate(fs.lstatSync(dir)) ? dir : undefined;
  } catch {
    return undefined;
  }
}

function isPrivate(stat: fs.Stats): boolean {
  if (!stat.isDirectory()) return false;
  if (typeof process.getuid !== 'function') return true;
  return stat.uid === process.getuid() && (stat.mode & 0o022) === 0;
}
