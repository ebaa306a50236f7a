import { rm } from 'node:fs/promises';
import type { Readable } from 'node:stream';
import type { Entry, ZipFile } from 'yauzl';
import { EntryByteGuard } from './entry-byte-guard';
import { openZip, zipEntries } from './open-zip';
import { SafeTreeWriter } from './safe-tree-writer';
import type { UploadLimits } from './upload-limits';
import { refuseEntry, UploadRefusedError } from './upload-errors';
import { ZipEntryChecker, type CheckedEntry, type ZipSummary } from './zip-entry-checks';
import { inspectZip } from './zip-inspection';

/**
 * Unpacks a zip into `destDir`, which must not exist or be an empty folder, keeping entry paths
 * as they are. The whole zip is inspected first, so a refused zip writes nothing; while unpacking,
 * every entry is checked again and its actual bytes are held to its header. On any failure
 * `destDir` is removed entirely. Resolves with the same summary as inspectZip.
 */
export async function extractZip(file: string, destDir: string, limits: UploadLimits): Promise<ZipSummary> {
  await inspectZip(file, limits);
  const writer = await SafeTreeWriter.create(destDir);
  // The entry being unpacked: a broken entry's inflate error can also surface through the zip's
  // own entry iteration (yauzl re-emits it), and must still name the entry.
  let current: CheckedEntry | undefined;
  try {
    const zip = await openZip(file, limits);
    try {
      const checker = new ZipEntryChecker(limits);
      for await (const entry of zipEntries(zip)) {
        const checked = checker.check(entry);
        current = checked;
        if (checked.kind === 'folder') await writer.folder(checked.segments);
        else await unpackFile(zip, entry, checked, writer);
      }
      return checker.finish();
    } finally {
      zip.close();
    }
  } catch (err) {
    await rm(writer.root, { recursive: true, force: true });
    throw current ? asDamagedData(err, current) : err;
  }
}

async function unpackFile(zip: ZipFile, entry: Entry, checked: CheckedEntry, writer: SafeTreeWriter): Promise<void> {
  const source = await openEntry(zip, entry, checked);
  try {
    await writer.file(checked.segments, source, new EntryByteGuard(checked.name, checked.size, entry.crc32));
  } catch (err) {
    // An unread entry stream would keep the zip's file open.
    source.destroy();
    throw asDamagedData(err, checked);
  }
}

async function openEntry(zip: ZipFile, entry: Entry, checked: CheckedEntry): Promise<Readable> {
  try {
    const stream = await zip.openReadStreamPromise(entry);
    // yauzl forwards errors to this stream from a setImmediate and its destroy leaves the zlib
    // handle running, so a broken entry can emit a second error after the write has already
    // failed with the first and dropped its listeners; unheard, that one would crash the process.
    // The write's own listeners still receive every error while it reads.
    stream.on('error', () => undefined);
    return stream;
  } catch (err) {
    throw refuseEntry('damaged_zip', checked.name, `its data cannot be found in the zip (${(err as Error).message}); the zip is damaged.`);
  }
}

/** Data that will not inflate is a damaged zip; disk and other server faults stay as they are. */
function asDamagedData(err: unknown, checked: CheckedEntry): unknown {
  if (err instanceof UploadRefusedError) return err;
  // Operating-system faults (ENOSPC, EIO, EACCES…) are ours; anything else that breaks while an
  // entry's bytes are read (zlib's Z_* codes, or a zlib message without a code when the error
  // surfaces through another stream) is the zip's data.
  const code = (err as NodeJS.ErrnoException | undefined)?.code;
  const systemFault = typeof code === 'string' && /^E[A-Z]+$/.test(code);
  // (Not `instanceof Error`: errors made by Node's own zlib may come from another realm under test runners.)
  if (!systemFault && typeof (err as Error | null)?.message === 'string') {
    return refuseEntry('damaged_zip', checked.name, `its data cannot be unpacked (${(err as Error).message}); the zip is damaged.`);
  }
  return err;
}
