import { randomBytes } from 'node:crypto';
import { mkdir, mkdtemp, readdir, readFile, rm, stat, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { extractZip } from './extract-zip';
import { refusalOf } from './testing/refusal-of';
import { zipWithYazl } from './testing/yazl-zip';
import { S_IFLNK, zipBytes, type RawZipEntry } from './testing/zip-bytes';
import { DEFAULT_UPLOAD_LIMITS, type UploadLimits } from './upload-limits';

describe('extractZip', () => {
  let dir: string;
  let out: string;
  beforeEach(async () => {
    dir = await mkdtemp(join(tmpdir(), 'seamline-extract-'));
    out = join(dir, 'scans', 'one');
  });
  afterEach(() => rm(dir, { recursive: true, force: true }));

  async function extract(bytes: Buffer, over: Partial<UploadLimits> = {}) {
    const file = join(dir, 'upload.zip');
    await writeFile(file, bytes);
    return extractZip(file, out, { ...DEFAULT_UPLOAD_LIMITS, ...over });
  }

  /** Every path below `root`, folders ending in `/`. */
  async function tree(root: string): Promise<string[]> {
    const entries = await readdir(root, { recursive: true, withFileTypes: true });
    return entries.map((e) => join(e.parentPath, e.name).slice(root.length + 1) + (e.isDirectory() ? '/' : '')).sort();
  }

  async function exists(path: string): Promise<boolean> {
    return stat(path).then(
      () => true,
      () => false,
    );
  }

  const good: RawZipEntry = { name: 'app/src/ok.ts', data: 'export const ok = 1;\n' };

  describe('a sound zip', () => {
    it('should unpack every file and folder with its exact contents, keeping the top folder', async () => {
      const logo = randomBytes(200_000);
      const bytes = await zipWithYazl({ 'app/src/main.ts': 'main();\n', 'app/README.md': '# App\n', 'app/assets/logo.bin': logo }, ['app/empty/']);
      const summary = await extract(bytes);
      expect(summary).toEqual({ entries: 4, files: 3, totalUncompressedBytes: 14 + logo.length, topFolder: 'app' });
      expect(await tree(out)).toEqual(['app/', 'app/README.md', 'app/assets/', 'app/assets/logo.bin', 'app/empty/', 'app/src/', 'app/src/main.ts']);
      expect(await readFile(join(out, 'app/src/main.ts'), 'utf8')).toBe('main();\n');
      expect((await readFile(join(out, 'app/assets/logo.bin'))).equals(logo)).toBe(true);
    });

    it('should write no file as executable', async () => {
      await extract(zipBytes([{ name: 'app/run.sh', data: '#!/bin/sh\n', unixMode: 0o100755 }]));
      expect((await stat(join(out, 'app/run.sh'))).mode & 0o111).toBe(0);
    });

    it('should unpack backslash names and inner ".." to the paths they resolve to', async () => {
      await extract(zipBytes([{ name: 'app\\src\\a.ts', data: 'a' }, { name: 'app/lib/../b.ts', data: 'b' }, { name: 'app/x/', method: 0 }]));
      expect(await tree(out)).toEqual(['app/', 'app/b.ts', 'app/src/', 'app/src/a.ts', 'app/x/']);
    });

    it('should unpack to the same name it checked, the Unicode Path one when present', async () => {
      await extract(zipBytes([{ name: 'app/caf\x82.ts', unicodePath: 'app/café.ts', data: 'c', flags: 0 }]));
      expect(await tree(out)).toEqual(['app/', 'app/café.ts']);
    });

    it('should unpack into an empty folder that already exists', async () => {
      await mkdir(out, { recursive: true });
      await extract(zipBytes([good]));
      expect(await tree(out)).toEqual(['app/', 'app/src/', 'app/src/ok.ts']);
    });
  });

  describe('a refused zip', () => {
    it('should write nothing when inspection refuses it', async () => {
      const err = await refusalOf(extract(zipBytes([good, { name: 'app/link', data: '/etc', method: 0, unixMode: S_IFLNK | 0o777 }])));
      expect(err.code).toBe('unsafe_entry');
      expect(err.message).toMatch(/"app\/link": it is a symbolic link/);
      expect(await exists(out)).toBe(false);
    });

    it('should refuse a folder with something in it and leave that folder alone', async () => {
      await mkdir(out, { recursive: true });
      await writeFile(join(out, 'keep.txt'), 'keep');
      await expect(extract(zipBytes([good]))).rejects.toThrow(/already exists and is not an empty folder/);
      expect(await tree(out)).toEqual(['keep.txt']);
    });
  });

  describe('data that does not match its header', () => {
    it('should stop at the first byte past a size the header understates, and remove everything', async () => {
      const bytes = zipBytes([good, { name: 'app/bomb.bin', data: Buffer.alloc(4 * 1024 * 1024), declaredSize: 1000 }]);
      const err = await refusalOf(extract(bytes));
      expect(err).toMatchObject({ code: 'zip_bomb', status: 422, details: { entry: 'app/bomb.bin' } });
      expect(err.message).toBe(
        'Refused zip entry "app/bomb.bin": it unpacks to more than the 1000 bytes its header declares; understated sizes are how zip bombs slip past limits.',
      );
      expect(await exists(out)).toBe(false);
    });

    it('should refuse an entry shorter than its header says', async () => {
      const err = await refusalOf(extract(zipBytes([good, { name: 'app/short.ts', data: 'x'.repeat(100), declaredSize: 5000 }])));
      expect(err.code).toBe('damaged_zip');
      expect(err.message).toBe('Refused zip entry "app/short.ts": it unpacks to 100 bytes, less than the 4.9 KB its header declares; the zip is damaged.');
      expect(await exists(out)).toBe(false);
    });

    it('should refuse an entry whose checksum does not match', async () => {
      const err = await refusalOf(extract(zipBytes([good, { name: 'app/altered.ts', data: 'altered', crc: 12345 }])));
      expect(err.code).toBe('damaged_zip');
      expect(err.message).toBe('Refused zip entry "app/altered.ts": its contents do not match their checksum; the zip is damaged.');
      expect(await exists(out)).toBe(false);
    });

    it('should refuse data that will not inflate', async () => {
      const err = await refusalOf(extract(zipBytes([good, { name: 'app/garbled.ts', data: 'abcd', packed: Buffer.from([0xff, 0xff, 0xff, 0xff]) }])));
      expect(err.code).toBe('damaged_zip');
      expect(err.message).toMatch(/^Refused zip entry "app\/garbled.ts": its data cannot be unpacked \(.+\); the zip is damaged\.$/);
      expect(await exists(out)).toBe(false);
    });

    it('should refuse an entry whose data is not where the zip says', async () => {
      const bytes = zipBytes([good, { name: 'app/lost.ts', data: 'lost' }]);
      bytes.writeUInt32LE(0, bytes.indexOf(Buffer.from([0x50, 0x4b, 0x03, 0x04]), 1));
      const err = await refusalOf(extract(bytes));
      expect(err.code).toBe('damaged_zip');
      expect(err.message).toMatch(/^Refused zip entry "app\/lost.ts": its data cannot be found in the zip \(invalid local file header signature: 0x0\)/);
      expect(await exists(out)).toBe(false);
    });
  });
});
