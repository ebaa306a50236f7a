import { constants } from 'node:fs';
import { lstat, mkdir, open, readdir } from 'node:fs/promises';
import * as path from 'node:path';
import type { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';

const FOLDER_MODE = 0o755;
// Never executable: unpacked code is read, never run.
const FILE_MODE = 0o644;
// O_EXCL refuses to reuse any existing path and O_NOFOLLOW to write through a link.
const NEW_FILE_FLAGS = constants.O_WRONLY | constants.O_CREAT | constants.O_EXCL | constants.O_NOFOLLOW;

/**
 * Writes files and folders below one root it creates itself, checking that every target resolves
 * inside the root and that every folder on the way is a real folder, not a link.
 */
export class SafeTreeWriter {
  private readonly folders = new Set<string>();

  private constructor(readonly root: string) {}

  /** Creates `dir` (and its parents), or takes it if it is an empty folder already. */
  static async create(dir: string): Promise<SafeTreeWriter> {
    const root = path.resolve(dir);
    await mkdir(path.dirname(root), { recursive: true });
    try {
      await mkdir(root, FOLDER_MODE);
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code !== 'EEXIST') throw err;
      const stat = await lstat(root);
      if (!stat.isDirectory() || (await readdir(root)).length > 0) {
        throw new Error(`Cannot unpack into ${root}: it already exists and is not an empty folder.`);
      }
    }
    return new SafeTreeWriter(root);
  }

  /** Makes the folder at `segments` below the root, one level at a time. */
  async folder(segments: readonly string[]): Promise<void> {
    for (let depth = 1; depth <= segments.length; depth++) {
      const target = this.inside(segments.slice(0, depth));
      if (this.folders.has(target)) continue;
      try {
        await mkdir(target, FOLDER_MODE);
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code !== 'EEXIST') throw err;
        // Only a folder this writer made may be reused; anything else got there behind its back.
        throw new Error(`Cannot unpack into ${target}: something is already there.`);
      }
      this.folders.add(target);
    }
  }

  /** Streams `source` into a new file at `segments` below the root; the file must not exist yet. */
  async file(segments: readonly string[], source: Readable, ...transforms: NodeJS.ReadWriteStream[]): Promise<void> {
    await this.folder(segments.slice(0, -1));
    const handle = await open(this.inside(segments), NEW_FILE_FLAGS, FILE_MODE);
    await pipeline([source, ...transforms, handle.createWriteStream()]);
  }

  private inside(segments: readonly string[]): string {
    const target = path.resolve(this.root, ...segments);
    const relative = path.relative(this.root, target);
    if (relative === '' || relative === '..' || relative.startsWith(`..${path.sep}`) || path.isAbsolute(relative)) {
      throw new Error(`Refusing to write ${target}: it is not inside ${this.root}.`);
    }
    return target;
  }
}
