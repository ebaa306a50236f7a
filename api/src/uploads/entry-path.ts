import { refuseEntry } from './upload-errors';

/** Where a zip entry lands, relative to the folder it is unpacked into. */
export interface EntryPath {
  /** Path segments below the root; empty only when the name is the root itself (e.g. `./`). */
  segments: string[];
  /** The segments joined with `/`. */
  path: string;
  /** The name ends with a separator, which marks a folder entry. */
  endsWithSeparator: boolean;
}

/** Most file systems refuse longer names; refusing here says so before anything is written. */
const MAX_SEGMENT_BYTES = 255;

/**
 * Resolves an entry name to a path inside the root, or refuses it. Backslashes count as separators
 * (some Windows tools write them), so `..\..\x` is caught like `../../x`.
 */
export function resolveEntryPath(name: string, maxDepth: number): EntryPath {
  if (name.length === 0) throw refuseEntry('unsafe_entry', name, 'it has an empty name.');
  if (/[\u0000-\u001f\u007f]/.test(name)) {
    throw refuseEntry('unsupported_entry', name, 'its name contains control characters, which Seamline does not unpack.');
  }
  const slashed = name.replace(/\\/g, '/');
  if (slashed.startsWith('//')) {
    throw refuseEntry('unsafe_entry', name, "it is a network (UNC) path; entries must be relative to the zip's root.");
  }
  if (slashed.startsWith('/')) {
    throw refuseEntry('unsafe_entry', name, "it is an absolute path; entries must be relative to the zip's root.");
  }
  if (/^[A-Za-z]:/.test(slashed)) {
    throw refuseEntry('unsafe_entry', name, "it starts with a drive letter; entries must be relative to the zip's root.");
  }

  const segments: string[] = [];
  for (const segment of slashed.split('/')) {
    if (segment === '' || segment === '.') continue;
    if (segment === '..') {
      if (segments.length === 0) {
        throw refuseEntry('unsafe_entry', name, `its ".." segments lead outside the zip's root.`);
      }
      segments.pop();
      continue;
    }
    if (Buffer.byteLength(segment) > MAX_SEGMENT_BYTES) {
      throw refuseEntry('unsupported_entry', name, `one part of its path is longer than ${MAX_SEGMENT_BYTES} bytes, which file systems do not allow.`);
    }
    segments.push(segment);
  }
  if (segments.length > maxDepth) {
    throw refuseEntry('too_deep', name, `it is ${segments.length} levels deep; the limit is ${maxDepth}.`, maxDepth);
  }
  return { segments, path: segments.join('/'), endsWithSeparator: slashed.endsWith('/') };
}
