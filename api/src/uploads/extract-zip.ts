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
  try {
    const zip = await openZip(file, limits);
    try {
      const checker = new ZipEntryChecker(limits);
      for await (const entry of zipEntries(zip)) {
        const checked = checker.check(entry);
        if (checked.kind === 'folder') await writer.folder(checked.segments);
        else await unpackFile(zip, entry, checked, writer);
      }
      return checker.finish();
    } finally {
      zip.close();
    }
  } catch (err) {
    await rm(writer.root, { recursive: true, force: true });
    throw err;
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
    return await zip.openReadStreamPromise(entry);
  } catch (err) {
    throw refuseEntry('damaged_zip', checked.name, `its data cannot be found in the zip (${(err as Error).message}); the zip is damaged.`);
  }
}

/** Data that will not inflate is a damaged zip; disk and other server faults stay as they are. */
function asDamagedData(err: unknown, checked: CheckedEntry): unknown {
  if (err instanceof UploadRefusedError) return err;
  const code = (err as NodeJS.ErrnoException | undefined)?.code;
  if (typeof code === 'string' && code.startsWith('Z_')) {
    return refuseEntry('damaged_zip', checked.name, `its data cannot be unpacked (${(err as Error).message}); the zip is damaged.`);
  }
  return err;
}
