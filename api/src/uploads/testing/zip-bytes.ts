import { crc32, deflateRawSync } from 'node:zlib';

/**
 * Writes small zips byte by byte, so tests can build what honest zip writers refuse to:
 * links, devices, `../` and absolute names, lying sizes, entries sharing data.
 */
export interface RawZipEntry {
  name: string | Buffer;
  data?: Buffer | string;
  /** 0 stores, 8 deflates (the default). */
  method?: number;
  /** Written as the entry's data instead of `data` packed by `method`. */
  packed?: Buffer;
  /** Full unix st_mode, written to the high 16 bits of the external attributes. */
  unixMode?: number;
  /** General purpose bit flag; bit 0 marks encryption, bit 11 UTF-8 names (set by default). */
  flags?: number;
  /** Overrides the unpacked size both headers declare, to make them lie. */
  declaredSize?: number;
  /** Overrides the checksum both headers declare. */
  crc?: number;
  /** A second name in an Info-ZIP Unicode Path extra field, which readers prefer to `name`. */
  unicodePath?: string;
  /** Writes no data of its own: the central entry points at entry N's local header instead. */
  sharesDataWith?: number;
}

const UTF8_NAMES = 0x0800;
const MADE_BY_UNIX = (3 << 8) | 30;
export const S_IFREG = 0o100000;
export const S_IFDIR = 0o040000;
export const S_IFLNK = 0o120000;
export const S_IFCHR = 0o020000;
export const S_IFBLK = 0o060000;
export const S_IFIFO = 0o010000;
export const S_IFSOCK = 0o140000;

interface Written {
  offset: number;
  name: Buffer;
  extra: Buffer;
  flags: number;
  method: number;
  crc: number;
  compressedSize: number;
  declaredSize: number;
}

/** A complete zip holding `entries`, in order. */
export function zipBytes(entries: RawZipEntry[]): Buffer {
  const chunks: Buffer[] = [];
  let offset = 0;
  const push = (b: Buffer) => {
    chunks.push(b);
    offset += b.length;
  };
  const written: Written[] = [];

  for (const entry of entries) {
    if (entry.sharesDataWith !== undefined) {
      const shared = written[entry.sharesDataWith];
      if (!shared) throw new Error(`zipBytes: entry ${entry.sharesDataWith} is not written yet`);
      written.push({ ...shared, name: toName(entry.name), extra: unicodePathField(entry) });
      continue;
    }
    const name = toName(entry.name);
    const data = Buffer.from(entry.data ?? '');
    const method = entry.method ?? 8;
    const packed = entry.packed ?? (method === 8 ? deflateRawSync(data) : data);
    const w: Written = {
      offset,
      name,
      extra: unicodePathField(entry),
      flags: entry.flags ?? UTF8_NAMES,
      method,
      crc: entry.crc ?? crc32(data),
      compressedSize: packed.length,
      declaredSize: entry.declaredSize ?? data.length,
    };
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0);
    local.writeUInt16LE(20, 4);
    local.writeUInt16LE(w.flags, 6);
    local.writeUInt16LE(w.method, 8);
    local.writeUInt16LE(0, 10);
    local.writeUInt16LE(0x21, 12); // 1980-01-01
    local.writeUInt32LE(w.crc >>> 0, 14);
    local.writeUInt32LE(w.compressedSize, 18);
    local.writeUInt32LE(w.declaredSize, 22);
    local.writeUInt16LE(name.length, 26);
    local.writeUInt16LE(w.extra.length, 28);
    push(local);
    push(name);
    push(w.extra);
    push(packed);
    written.push(w);
  }

  const centralStart = offset;
  entries.forEach((entry, i) => {
    const w = written[i]!;
    const central = Buffer.alloc(46);
    central.writeUInt32LE(0x02014b50, 0);
    central.writeUInt16LE(MADE_BY_UNIX, 4);
    central.writeUInt16LE(20, 6);
    central.writeUInt16LE(w.flags, 8);
    central.writeUInt16LE(w.method, 10);
    central.writeUInt16LE(0, 12);
    central.writeUInt16LE(0x21, 14);
    central.writeUInt32LE(w.crc >>> 0, 16);
    central.writeUInt32LE(w.compressedSize, 20);
    central.writeUInt32LE(w.declaredSize, 24);
    central.writeUInt16LE(w.name.length, 28);
    central.writeUInt16LE(w.extra.length, 30);
    central.writeUInt16LE(0, 32);
    central.writeUInt16LE(0, 34);
    central.writeUInt16LE(0, 36);
    central.writeUInt32LE(((entry.unixMode ?? defaultMode(w.name)) << 16) >>> 0, 38);
    central.writeUInt32LE(w.offset, 42);
    push(central);
    push(w.name);
    push(w.extra);
  });
  const centralSize = offset - centralStart;

  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(entries.length, 8);
  end.writeUInt16LE(entries.length, 10);
  end.writeUInt32LE(centralSize, 12);
  end.writeUInt32LE(centralStart, 16);
  push(end);
  return Buffer.concat(chunks);
}

function unicodePathField(entry: RawZipEntry): Buffer {
  if (entry.unicodePath === undefined) return Buffer.alloc(0);
  const path = Buffer.from(entry.unicodePath, 'utf8');
  const field = Buffer.alloc(9 + path.length);
  field.writeUInt16LE(0x7075, 0);
  field.writeUInt16LE(5 + path.length, 2);
  field.writeUInt8(1, 4);
  field.writeUInt32LE(crc32(toName(entry.name)) >>> 0, 5);
  path.copy(field, 9);
  return field;
}

function toName(name: string | Buffer): Buffer {
  return typeof name === 'string' ? Buffer.from(name, 'utf8') : name;
}

function defaultMode(name: Buffer): number {
  return name.toString('utf8').endsWith('/') ? S_IFDIR | 0o755 : S_IFREG | 0o644;
}
