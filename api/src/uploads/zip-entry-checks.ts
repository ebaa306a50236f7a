import { getFileNameLowLevel, type Entry } from 'yauzl';
import { formatBytes } from './byte-size';
import { resolveEntryPath } from './entry-path';
import type { UploadLimits } from './upload-limits';
import { quoteEntryName, refuseEntry, UploadRefusedError } from './upload-errors';

/** What a zip holds, once every entry has passed the checks. */
export interface ZipSummary {
  /** Central directory entries, folders included. */
  entries: number;
  /** Regular files. */
  files: number;
  /** Sum of the files' declared unpacked sizes (extraction holds each file to its declared size). */
  totalUncompressedBytes: number;
  /** The one top-level folder every file sits in, if there is one (`my-app` for `my-app/src/x.ts`). */
  topFolder: string | null;
}

/** An entry that passed the checks, and where it lands below the root. */
export interface CheckedEntry {
  /** The name as the zip spells it, for messages. */
  name: string;
  kind: 'file' | 'folder';
  /** Below the root; empty only for a folder entry naming the root itself (`./`). */
  segments: string[];
  path: string;
  /** Declared unpacked bytes. */
  size: number;
}

/**
 * The compression ratio is judged only from this size up: a small file of repeated
 * characters packs very tightly yet unpacks to nothing worth refusing.
 */
export const RATIO_CHECK_FLOOR_BYTES = 1024 * 1024;

const STORED = 0;
const DEFLATED = 8;
/** Local file header (30 bytes) before each entry's data; used to spot entries sharing bytes. */
const LOCAL_HEADER_MIN_BYTES = 30;

const FILE_TYPE_MASK = 0o170000;
const S_IFREG = 0o100000;
const S_IFDIR = 0o040000;
const REFUSED_TYPES: Record<number, string> = {
  0o120000: 'a symbolic link; Seamline never unpacks links',
  0o020000: 'a character device; only regular files and folders are unpacked',
  0o060000: 'a block device; only regular files and folders are unpacked',
  0o010000: 'a named pipe (FIFO); only regular files and folders are unpacked',
  0o140000: 'a socket; only regular files and folders are unpacked',
};

/**
 * The entry's name as written in the zip. Names are decoded here rather than by yauzl so that
 * no rewriting or refusal happens before these checks can say which entry and why.
 */
export function entryName(entry: Entry): string {
  return getFileNameLowLevel(entry.generalPurposeBitFlag, entry.fileNameRaw, entry.extraFields, true);
}

/**
 * Checks entries one by one, in central directory order, and keeps the running totals,
 * so a refusal comes at the first bad entry and names it.
 */
export class ZipEntryChecker {
  private entries = 0;
  private files = 0;
  private totalBytes = 0;
  private totalPackedBytes = 0;
  private readonly filePaths = new Set<string>();
  private readonly folderPaths = new Set<string>();
  private topFolder: string | null | undefined;
  private readonly extents: { start: number; minEnd: number; name: string }[] = [];

  constructor(private readonly limits: UploadLimits) {}

  check(entry: Entry): CheckedEntry {
    const name = entryName(entry);
    // The entry count limit is checked once, when the zip is opened: yauzl reads exactly that many.
    this.entries++;
    const folderByMode = fileTypeIsFolder(entry, name);
    if (entry.isEncrypted()) {
      throw refuseEntry('unsupported_entry', name, 'it is password-protected; upload a zip made without a password.');
    }
    const where = resolveEntryPath(name, this.limits.maxPathDepth);
    const kind = folderByMode || where.endsWithSeparator ? 'folder' : 'file';
    this.extents.push({
      start: entry.relativeOffsetOfLocalHeader,
      minEnd: entry.relativeOffsetOfLocalHeader + LOCAL_HEADER_MIN_BYTES + entry.compressedSize,
      name,
    });
    const checked: CheckedEntry = { name, kind, segments: where.segments, path: where.path, size: entry.uncompressedSize };
    if (kind === 'folder') this.checkFolder(entry, checked);
    else this.checkFile(entry, checked);
    return checked;
  }

  /** Checks what only the whole zip shows, and sums it up. */
  finish(): ZipSummary {
    if (this.entries === 0) {
      throw new UploadRefusedError('empty_zip', 'The zip has no entries. Zip the codebase folder and upload that zip.');
    }
    if (this.files === 0) {
      throw new UploadRefusedError('empty_zip', 'The zip holds only folders and no files. Zip the codebase folder with its files and upload that zip.');
    }
    this.refuseSharedData();
    const ratio = this.totalBytes / Math.max(this.totalPackedBytes, 1);
    if (this.totalBytes >= RATIO_CHECK_FLOOR_BYTES && ratio > this.limits.maxCompressionRatio) {
      throw new UploadRefusedError(
        'zip_bomb',
        `Refused zip: its ${this.files} files unpack to ${formatBytes(this.totalBytes)} from ${formatBytes(this.totalPackedBytes)}, ` +
          `${Math.floor(ratio)} times their packed size; the limit is ${this.limits.maxCompressionRatio} times, as ratios this high are how zip bombs work.`,
        { limit: this.limits.maxCompressionRatio },
      );
    }
    return {
      entries: this.entries,
      files: this.files,
      totalUncompressedBytes: this.totalBytes,
      topFolder: this.topFolder ?? null,
    };
  }

  private checkFolder(entry: Entry, e: CheckedEntry): void {
    // Only the unpacked size counts: some writers deflate folders to 2 bytes of nothing.
    if (entry.uncompressedSize > 0) {
      throw refuseEntry('unsafe_entry', e.name, `it is a folder, yet it carries ${formatBytes(entry.uncompressedSize)} of data.`);
    }
    if (e.segments.length === 0) return;
    this.claimFolders(e, e.segments.length);
  }

  private checkFile(entry: Entry, e: CheckedEntry): void {
    const { limits } = this;
    if (e.segments.length === 0) {
      throw refuseEntry('unsafe_entry', e.name, "it names the zip's root rather than a file inside it.");
    }
    if (entry.compressionMethod !== STORED && entry.compressionMethod !== DEFLATED) {
      throw refuseEntry(
        'unsupported_entry',
        e.name,
        `it uses compression method ${entry.compressionMethod}; only stored and deflated entries are read. Re-create the zip with standard compression.`,
      );
    }
    if (entry.compressionMethod === STORED && entry.compressedSize !== entry.uncompressedSize) {
      throw refuseEntry(
        'damaged_zip',
        e.name,
        `it is stored uncompressed, yet its header gives ${entry.compressedSize} bytes packed and ${entry.uncompressedSize} unpacked; the zip is damaged.`,
      );
    }
    if (e.size > limits.maxEntryBytes) {
      throw refuseEntry('upload_too_large', e.name, `it unpacks to ${formatBytes(e.size)}, over the ${formatBytes(limits.maxEntryBytes)} limit for one file.`, limits.maxEntryBytes);
    }
    if (this.totalBytes + e.size > limits.maxTotalUncompressedBytes) {
      throw refuseEntry(
        'upload_too_large',
        e.name,
        `with it the zip unpacks to more than ${formatBytes(limits.maxTotalUncompressedBytes)}, the limit for a whole upload.`,
        limits.maxTotalUncompressedBytes,
      );
    }
    const ratio = e.size / Math.max(entry.compressedSize, 1);
    if (e.size >= RATIO_CHECK_FLOOR_BYTES && ratio > limits.maxCompressionRatio) {
      throw refuseEntry(
        'zip_bomb',
        e.name,
        `it unpacks to ${formatBytes(e.size)} from ${formatBytes(entry.compressedSize)}, ${Math.floor(ratio)} times its packed size; ` +
          `the limit is ${limits.maxCompressionRatio} times, as ratios this high are how zip bombs work.`,
        limits.maxCompressionRatio,
      );
    }
    if (this.filePaths.has(e.path)) {
      throw refuseEntry('unsafe_entry', e.name, `another entry already unpacks to "${e.path}"; a zip must name each file once.`);
    }
    if (this.folderPaths.has(e.path)) {
      throw refuseEntry('unsafe_entry', e.name, `it is a file, yet other entries use "${e.path}" as a folder.`);
    }
    this.claimFolders(e, e.segments.length - 1);
    this.filePaths.add(e.path);
    this.files++;
    this.totalBytes += e.size;
    this.totalPackedBytes += entry.compressedSize;
    const top = e.segments.length > 1 ? e.segments[0]! : null;
    this.topFolder = this.topFolder === undefined || this.topFolder === top ? top : null;
  }

  /** Records the first `depth` segments of the entry's path as folders, refusing any that is a file. */
  private claimFolders(e: CheckedEntry, depth: number): void {
    for (let i = 1; i <= depth; i++) {
      const folder = e.segments.slice(0, i).join('/');
      if (this.filePaths.has(folder)) {
        throw refuseEntry('unsafe_entry', e.name, `it needs "${folder}" to be a folder, but another entry is a file there.`);
      }
      this.folderPaths.add(folder);
    }
  }

  /** Entries whose bytes overlap let a small zip unpack many times over. */
  private refuseSharedData(): void {
    const sorted = [...this.extents].sort((a, b) => a.start - b.start);
    for (let i = 1; i < sorted.length; i++) {
      const before = sorted[i - 1]!;
      const entry = sorted[i]!;
      if (entry.start < before.minEnd) {
        throw refuseEntry('zip_bomb', entry.name, `its data overlaps that of entry ${quoteEntryName(before.name)}; entries sharing bytes are a zip-bomb trick.`);
      }
    }
  }
}

/** True for a folder by unix mode; throws for links, devices and other non-regular files. */
function fileTypeIsFolder(entry: Entry, name: string): boolean {
  const type = (entry.externalFileAttributes >>> 16) & FILE_TYPE_MASK;
  // Type 0 means the writer recorded no unix mode (e.g. on Windows); the name decides then.
  if (type === 0 || type === S_IFREG) return false;
  if (type === S_IFDIR) return true;
  const what = REFUSED_TYPES[type] ?? `of unix file type 0o${type.toString(8)}, which is neither a regular file nor a folder`;
  throw refuseEntry('unsafe_entry', name, `it is ${what}.`);
}
