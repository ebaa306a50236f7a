import { open as openFile } from 'node:fs/promises';
import { openPromise, type Entry, type ZipFile } from 'yauzl';
import type { UploadLimits } from './upload-limits';
import { quoteEntryName, UploadRefusedError } from './upload-errors';
import { entryName } from './zip-entry-checks';

const HEAD_BYTES = 8;

/**
 * Opens an uploaded file as a zip for reading entry by entry, after checking it is one and that
 * its entry count is within the limit. The caller closes it.
 */
export async function openZip(file: string, limits: UploadLimits): Promise<ZipFile> {
  await refuseNonZip(file);
  let zip: ZipFile;
  try {
    // Names stay raw and sizes unchecked by yauzl: our own checks refuse with the entry's name.
    zip = await openPromise(file, { lazyEntries: true, autoClose: false, decodeStrings: false, validateEntrySizes: false });
  } catch (err) {
    throw new UploadRefusedError(
      'damaged_zip',
      `The uploaded file starts like a zip but cannot be read (${(err as Error).message}). It may be cut short; zip the folder again and upload the new file.`,
    );
  }
  // A reader error may come after the last entry was read, when nobody is listening for one.
  zip.on('error', () => undefined);
  if (zip.entryCount > limits.maxEntries) {
    zip.close();
    throw new UploadRefusedError('too_many_entries', `The zip has ${zip.entryCount} entries; the limit is ${limits.maxEntries}.`, {
      limit: limits.maxEntries,
    });
  }
  return zip;
}

/** The zip's central directory entries, one at a time; a damaged directory is refused. */
export async function* zipEntries(zip: ZipFile): AsyncGenerator<Entry> {
  let read = 0;
  let last: Entry | undefined;
  for (;;) {
    let entry: Entry | null;
    try {
      entry = await nextEntry(zip);
    } catch (err) {
      throw damagedDirectory(err as Error, read, last);
    }
    if (!entry) return;
    read++;
    last = entry;
    yield entry;
  }
}

function nextEntry(zip: ZipFile): Promise<Entry | null> {
  return new Promise((resolve, reject) => {
    const settle = (fn: () => void) => {
      zip.off('entry', onEntry).off('end', onEnd).off('error', onError);
      fn();
    };
    const onEntry = (entry: Entry) => settle(() => resolve(entry));
    const onEnd = () => settle(() => resolve(null));
    const onError = (err: Error) => settle(() => reject(err));
    zip.on('entry', onEntry).on('end', onEnd).on('error', onError);
    zip.readEntry();
  });
}

function damagedDirectory(err: Error, read: number, last: Entry | undefined): UploadRefusedError {
  const where = last ? `after entry ${quoteEntryName(entryName(last))}` : 'at its first entry';
  // yauzl reads no further once an entry needs strong encryption, so only its position is known.
  if (/encryption/i.test(err.message)) {
    return new UploadRefusedError(
      'unsupported_entry',
      `Refused zip entry number ${read + 1} (${where}): it is encrypted; upload a zip made without a password.`,
    );
  }
  return new UploadRefusedError('damaged_zip', `The zip's list of entries is damaged ${where} (${err.message}). Zip the folder again and upload the new file.`);
}

/** Refuses an empty file and anything without the zip signature, saying what it looks like instead. */
async function refuseNonZip(file: string): Promise<void> {
  const handle = await openFile(file, 'r');
  let head: Buffer;
  try {
    const buffer = Buffer.alloc(HEAD_BYTES);
    const { bytesRead } = await handle.read(buffer, 0, HEAD_BYTES, 0);
    head = buffer.subarray(0, bytesRead);
  } finally {
    await handle.close();
  }
  if (head.length === 0) {
    throw new UploadRefusedError('empty_upload', 'The uploaded file is empty. Choose the zip of your codebase and upload it again.');
  }
  if (head.length < 4 || head[0] !== 0x50 || head[1] !== 0x4b) {
    throw new UploadRefusedError('not_a_zip', `The uploaded file is not a zip: ${lookalike(head)}. Zip the codebase folder and upload the .zip file.`);
  }
}

function lookalike(head: Buffer): string {
  if (head[0] === 0x1f && head[1] === 0x8b) return 'it is gzip-compressed (a .tar.gz or .gz file)';
  if (head.subarray(0, 6).equals(Buffer.from('377abcaf271c', 'hex'))) return 'it is a 7z archive';
  if (head.subarray(0, 4).toString('latin1') === 'Rar!') return 'it is a RAR archive';
  return 'it does not start with the zip signature';
}
