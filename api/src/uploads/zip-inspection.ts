import { openZip, zipEntries } from './open-zip';
import type { UploadLimits } from './upload-limits';
import { ZipEntryChecker, type ZipSummary } from './zip-entry-checks';

export type { ZipSummary } from './zip-entry-checks';

/**
 * Reads a zip's central directory, without unpacking anything, and refuses it with an
 * UploadRefusedError naming the first entry that is unsafe, unsupported or over a limit.
 */
export async function inspectZip(file: string, limits: UploadLimits): Promise<ZipSummary> {
  const zip = await openZip(file, limits);
  try {
    const checker = new ZipEntryChecker(limits);
    for await (const entry of zipEntries(zip)) checker.check(entry);
    return checker.finish();
  } finally {
    zip.close();
  }
}
