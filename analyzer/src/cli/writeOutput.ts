/**
 * Writing machine output
 * ======================
 * Output is produced as chunks (a snapshot streams one function at a time) and written either to
 * a stream, honouring back-pressure, or to a file atomically: the chunks go to a temporary file
 * beside the target, which is flushed to disk and then renamed over it. If producing or writing
 * any chunk fails, the temporary file is removed and the target is left as it was, so a reader
 * never sees a half-written file.
 *
 * [Reference]: POSIX rename(2) replaces the target atomically within one file system (common practice).
 */
import { once } from 'node:events';
import { promises as fsp } from 'node:fs';
import path from 'node:path';
import type { Writable } from 'node:stream';

/** The file-system calls an atomic write makes (tests replace them to simulate failures). */
export interface AtomicWriteFs {
  open: typeof fsp.open;
  rename: typeof fsp.rename;
  unlink: typeof fsp.unlink;
}

/** A target file that could not be written; `reason` is for people. */
export class OutputError extends Error {
  override readonly name = 'OutputError';

  constructor(
    readonly file: string,
    readonly reason: string,
  ) {
    super(`analyzer/cli: cannot write ${file}: ${reason}`);
  }
}

/** Temporary files being written right now, so an interrupted process can remove them. */
export const PENDING_TEMP_FILES = new Set<string>();

// Chunks are joined up to this size before each write: fewer system calls, bounded memory.
const BATCH_CHARS = 1 << 20;

function* batched(chunks: Iterable<string>): Generator<string> {
  let pending = '';
  for (const chunk of chunks) {
    pending += chunk;
    if (pending.length >= BATCH_CHARS) {
      yield pending;
      pending = '';
    }
  }
  if (pending !== '') yield pending;
}

/** Write chunks to a stream, waiting for `drain` when its buffer is full. */
export async function writeChunksToStream(stream: Writable, chunks: Iterable<string>): Promise<void> {
  for (const text of batched(chunks)) {
    if (!stream.write(text)) await once(stream, 'drain');
  }
}

function describeFsError(error: unknown, target: string): string {
  const code = (error as NodeJS.ErrnoException).code;
  if (code === 'ENOENT') return `the folder ${path.dirname(target)} does not exist`;
  if (code === 'EACCES' || code === 'EPERM') return 'permission denied';
  if (code === 'EISDIR') return 'it is a folder';
  if (code === 'ENOSPC') return 'no space left on the device';
  return (error as Error).message;
}

/** Write chunks to `target` through a temporary file and a rename; on any failure the target is untouched. */
export async function writeFileAtomic(target: string, chunks: Iterable<string>, fs: AtomicWriteFs = fsp): Promise<void> {
  const temp = path.join(path.dirname(target), `.${path.basename(target)}.${process.pid}.${Date.now().toString(36)}.tmp`);
  let handle: Awaited<ReturnType<typeof fsp.open>> | undefined;
  let created = false;
  try {
    handle = await fs.open(temp, 'wx');
    created = true;
    PENDING_TEMP_FILES.add(temp);
    for (const text of batched(chunks)) await handle.write(text);
    await handle.sync();
    await handle.close();
    handle = undefined;
    await fs.rename(temp, target);
    PENDING_TEMP_FILES.delete(temp);
  } catch (error) {
    await handle?.close().catch(() => undefined);
    if (created) await fs.unlink(temp).catch(() => undefined);
    PENDING_TEMP_FILES.delete(temp);
    // Duck-typed: errors from node's fs come from another realm under test runners.
    if (typeof (error as NodeJS.ErrnoException | undefined)?.code === 'string') throw new OutputError(target, describeFsError(error, target));
    throw error;
  }
}
