import { randomBytes, randomUUID } from 'node:crypto';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { refusalOf } from './testing/refusal-of';
import { zipWithYazl } from './testing/yazl-zip';
import { S_IFBLK, S_IFCHR, S_IFDIR, S_IFIFO, S_IFLNK, S_IFSOCK, zipBytes, type RawZipEntry } from './testing/zip-bytes';
import { DEFAULT_UPLOAD_LIMITS, type UploadLimits } from './upload-limits';
import { quoteEntryName } from './upload-errors';
import { RATIO_CHECK_FLOOR_BYTES } from './zip-entry-checks';
import { inspectZip } from './zip-inspection';

describe('inspectZip', () => {
  let dir: string;
  beforeEach(async () => {
    dir = await mkdtemp(join(tmpdir(), 'seamline-inspect-'));
  });
  afterEach(() => rm(dir, { recursive: true, force: true }));

  async function fileOf(bytes: Buffer): Promise<string> {
    const file = join(dir, `${randomUUID()}.zip`);
    await writeFile(file, bytes);
    return file;
  }
  const limits = (over: Partial<UploadLimits> = {}): UploadLimits => ({ ...DEFAULT_UPLOAD_LIMITS, ...over });
  const inspect = async (bytes: Buffer, over: Partial<UploadLimits> = {}) => inspectZip(await fileOf(bytes), limits(over));
  const good: RawZipEntry = { name: 'app/src/ok.ts', data: 'export const ok = 1;\n' };

  /** Refusal of an entry: the code, the status, and a message naming the entry and the reason. */
  async function expectEntryRefused(bytes: Buffer, code: string, entry: string, reason: RegExp, over: Partial<UploadLimits> = {}) {
    const err = await refusalOf(inspect(bytes, over));
    expect(err.code).toBe(code);
    expect(err.message).toContain(`Refused zip entry ${quoteEntryName(entry)}: `);
    expect(err.message).toMatch(reason);
    expect(err.details).toMatchObject({ entry });
    return err;
  }

  describe('a sound zip', () => {
    it('should sum up entries, files, unpacked bytes and the shared top folder', async () => {
      const bytes = await zipWithYazl({ 'app/src/main.ts': 'main();\n', 'app/README.md': '# App\n' }, ['app/docs/']);
      expect(await inspect(bytes)).toEqual({ entries: 3, files: 2, totalUncompressedBytes: 14, topFolder: 'app' });
    });

    it('should give no top folder when a file sits at the top or files sit in different folders', async () => {
      expect((await inspect(await zipWithYazl({ 'app/a.ts': 'a', 'README.md': 'r' }))).topFolder).toBeNull();
      expect((await inspect(await zipWithYazl({ 'app/a.ts': 'a', 'lib/b.ts': 'b' }))).topFolder).toBeNull();
      expect((await inspect(await zipWithYazl({ 'a.ts': 'a' }))).topFolder).toBeNull();
    });

    it('should read backslash names as folders, as Windows tools write them', async () => {
      const summary = await inspect(zipBytes([{ name: 'app\\src\\a.ts', data: 'a' }, { name: 'app\\b.ts', data: 'b' }]));
      expect(summary).toMatchObject({ files: 2, topFolder: 'app' });
    });

    it('should count a folder marked by its unix mode, and ignore a folder entry naming the root', async () => {
      const bytes = zipBytes([{ name: './' }, { name: 'app/sub', unixMode: S_IFDIR | 0o755 }, good]);
      expect(await inspect(bytes)).toEqual({ entries: 3, files: 1, totalUncompressedBytes: 21, topFolder: 'app' });
    });

    it('should accept small files that pack tightly and large files that do not', async () => {
      const bytes = zipBytes([
        { name: 'app/blank.txt', data: Buffer.alloc(RATIO_CHECK_FLOOR_BYTES / 4) },
        { name: 'app/noise.bin', data: randomBytes(RATIO_CHECK_FLOOR_BYTES + 1) },
      ]);
      expect((await inspect(bytes)).files).toBe(2);
    });

    it('should accept a zip exactly at its limits', async () => {
      const bytes = zipBytes([{ name: 'a/b/c.txt', data: 'x'.repeat(10) }, { name: 'a/d.txt', data: 'y'.repeat(10) }]);
      const summary = await inspect(bytes, { maxEntries: 2, maxPathDepth: 3, maxEntryBytes: 10, maxTotalUncompressedBytes: 20 });
      expect(summary.totalUncompressedBytes).toBe(20);
    });
  });

  describe('a file that is not a usable zip', () => {
    it('should refuse an empty file', async () => {
      const err = await refusalOf(inspect(Buffer.alloc(0)));
      expect(err).toMatchObject({ code: 'empty_upload', status: 400 });
      expect(err.message).toMatch(/file is empty/);
    });

    it('should refuse text, saying it lacks the zip signature', async () => {
      const err = await refusalOf(inspect(Buffer.from('just some text, not an archive')));
      expect(err).toMatchObject({ code: 'not_a_zip', status: 422 });
      expect(err.message).toMatch(/not a zip: it does not start with the zip signature/);
    });

    it('should refuse a gzip file, saying what it is', async () => {
      const err = await refusalOf(inspect(gzipSync('tarball')));
      expect(err.code).toBe('not_a_zip');
      expect(err.message).toMatch(/gzip-compressed \(a \.tar\.gz or \.gz file\)/);
    });

    it('should refuse a zip cut short', async () => {
      const whole = await zipWithYazl({ 'app/a.ts': 'a'.repeat(500) });
      const err = await refusalOf(inspect(whole.subarray(0, 60)));
      expect(err.code).toBe('damaged_zip');
      expect(err.message).toMatch(/starts like a zip but cannot be read/);
    });

    it('should refuse a zip whose list of entries is damaged, saying where', async () => {
      const bytes = zipBytes([good, { name: 'app/b.ts', data: 'b' }]);
      const second = bytes.lastIndexOf(Buffer.from([0x50, 0x4b, 0x01, 0x02]));
      bytes.writeUInt32LE(0xdeadbeef, second);
      const err = await refusalOf(inspect(bytes));
      expect(err.code).toBe('damaged_zip');
      expect(err.message).toMatch(/list of entries is damaged after entry "app\/src\/ok.ts"/);
    });

    it('should refuse a zip with no entries', async () => {
      const err = await refusalOf(inspect(zipBytes([])));
      expect(err).toMatchObject({ code: 'empty_zip', status: 422 });
      expect(err.message).toMatch(/no entries/);
    });

    it('should refuse a zip of folders only', async () => {
      const err = await refusalOf(inspect(await zipWithYazl({}, ['app/', 'app/src/'])));
      expect(err.code).toBe('empty_zip');
      expect(err.message).toMatch(/only folders and no files/);
    });
  });

  describe('entries that could escape or deceive', () => {
    it.each([
      ['../evil.ts', /".." segments lead outside the zip's root/],
      ['app/../../evil.ts', /".." segments lead outside the zip's root/],
      ['..\\evil.ts', /".." segments lead outside the zip's root/],
      ['/etc/cron.d/evil', /absolute path/],
      ['C:\\Windows\\evil.dll', /drive letter/],
      ['\\\\server\\share\\evil.ts', /network \(UNC\) path/],
    ])('should refuse the name %j', async (name, reason) => {
      const err = await expectEntryRefused(zipBytes([good, { name, data: 'x' }]), 'unsafe_entry', name, reason);
      expect(err.status).toBe(422);
    });

    it('should judge the Unicode Path name readers use, not the plain one beside it', async () => {
      const bytes = zipBytes([good, { name: 'app/harmless.ts', unicodePath: '../evil.ts', data: 'x' }]);
      await expectEntryRefused(bytes, 'unsafe_entry', '../evil.ts', /".." segments lead outside the zip's root/);
    });

    it('should refuse a symbolic link', async () => {
      const bytes = zipBytes([good, { name: 'app/passwd', data: '/etc/passwd', method: 0, unixMode: S_IFLNK | 0o777 }]);
      await expectEntryRefused(bytes, 'unsafe_entry', 'app/passwd', /a symbolic link; Seamline never unpacks links/);
    });

    it.each([
      [S_IFCHR, /a character device/],
      [S_IFBLK, /a block device/],
      [S_IFIFO, /a named pipe \(FIFO\)/],
      [S_IFSOCK, /a socket/],
      [0o070000, /of unix file type 0o70000, which is neither a regular file nor a folder/],
    ])('should refuse an entry of unix type %o', async (type, reason) => {
      await expectEntryRefused(zipBytes([{ name: 'app/dev', unixMode: type | 0o600 }, good]), 'unsafe_entry', 'app/dev', reason);
    });

    it('should refuse the same path twice, however it is spelt', async () => {
      const bytes = zipBytes([good, { name: 'app/./src/ok.ts', data: 'again' }]);
      await expectEntryRefused(bytes, 'unsafe_entry', 'app/./src/ok.ts', /another entry already unpacks to "app\/src\/ok.ts"/);
    });

    it('should refuse a file where other entries need a folder, in either order', async () => {
      await expectEntryRefused(
        zipBytes([{ name: 'app/src', data: 'file' }, good]),
        'unsafe_entry',
        'app/src/ok.ts',
        /needs "app\/src" to be a folder, but another entry is a file there/,
      );
      await expectEntryRefused(zipBytes([good, { name: 'app/src', data: 'file' }]), 'unsafe_entry', 'app/src', /it is a file, yet other entries use "app\/src" as a folder/);
      await expectEntryRefused(zipBytes([{ name: 'app', data: 'file' }, { name: 'app/' }]), 'unsafe_entry', 'app/', /needs "app" to be a folder/);
    });

    it('should refuse a folder entry that carries data', async () => {
      await expectEntryRefused(zipBytes([{ name: 'app/', data: 'hidden' }, good]), 'unsafe_entry', 'app/', /it is a folder, yet it carries 6 bytes of data/);
    });

    it('should refuse a file entry naming the root itself', async () => {
      await expectEntryRefused(zipBytes([good, { name: 'app/..', data: 'x' }]), 'unsafe_entry', 'app/..', /names the zip's root/);
    });

    it('should refuse entries that share their bytes', async () => {
      const bytes = zipBytes([good, { name: 'app/copy.ts', sharesDataWith: 0 }]);
      await expectEntryRefused(bytes, 'zip_bomb', 'app/copy.ts', /overlaps that of entry "app\/src\/ok.ts"; entries sharing bytes are a zip-bomb trick/);
    });

    it('should refuse a stored entry whose two sizes disagree', async () => {
      const bytes = zipBytes([{ name: 'app/a.ts', data: 'ten bytes!', method: 0, declaredSize: 4 }]);
      await expectEntryRefused(bytes, 'damaged_zip', 'app/a.ts', /stored uncompressed, yet its header gives 10 bytes packed and 4 unpacked/);
    });
  });

  describe('entries Seamline cannot read', () => {
    it('should refuse a password-protected entry', async () => {
      const bytes = zipBytes([good, { name: 'app/secret.ts', data: 'x', flags: 0x0801 }]);
      await expectEntryRefused(bytes, 'unsupported_entry', 'app/secret.ts', /password-protected/);
    });

    it('should refuse an entry under strong encryption, by its position', async () => {
      const bytes = zipBytes([good, { name: 'app/secret.ts', data: 'x', flags: 0x0841 }]);
      const err = await refusalOf(inspect(bytes));
      expect(err.code).toBe('unsupported_entry');
      expect(err.message).toBe('Refused zip entry number 2 (after entry "app/src/ok.ts"): it is encrypted; upload a zip made without a password.');
    });

    it('should refuse an unusual compression method', async () => {
      const bytes = zipBytes([{ name: 'app/a.ts', data: 'x', method: 12 }]);
      await expectEntryRefused(bytes, 'unsupported_entry', 'app/a.ts', /compression method 12; only stored and deflated/);
    });
  });

  describe('limits', () => {
    it('should refuse more entries than allowed before reading them', async () => {
      const bytes = await zipWithYazl({ 'a/1.ts': '1', 'a/2.ts': '2', 'a/3.ts': '3' });
      const err = await refusalOf(inspect(bytes, { maxEntries: 2 }));
      expect(err).toMatchObject({ code: 'too_many_entries', status: 422, details: { limit: 2 } });
      expect(err.message).toBe('The zip has 3 entries; the limit is 2.');
    });

    it('should refuse a path deeper than allowed', async () => {
      const err = await expectEntryRefused(zipBytes([good]), 'too_deep', 'app/src/ok.ts', /it is 3 levels deep; the limit is 2/, { maxPathDepth: 2 });
      expect(err.details).toEqual({ entry: 'app/src/ok.ts', limit: 2 });
    });

    it('should refuse, with 413, a file that unpacks over the limit for one file', async () => {
      const bytes = zipBytes([{ name: 'app/big.txt', data: 'x'.repeat(2048) }]);
      const err = await expectEntryRefused(bytes, 'upload_too_large', 'app/big.txt', /unpacks to 2 KB, over the 1 KB limit for one file/, { maxEntryBytes: 1024 });
      expect(err.status).toBe(413);
    });

    it('should refuse, with 413, the entry that takes the whole zip over its unpacked limit', async () => {
      const bytes = zipBytes(['a', 'b', 'c'].map((n) => ({ name: `app/${n}.txt`, data: n.repeat(600) })));
      const err = await expectEntryRefused(bytes, 'upload_too_large', 'app/c.txt', /with it the zip unpacks to more than 1.5 KB, the limit for a whole upload/, {
        maxTotalUncompressedBytes: 1536,
      });
      expect(err.status).toBe(413);
    });

    it('should refuse a large file that unpacks far beyond its packed size', async () => {
      const bytes = zipBytes([good, { name: 'app/zeros.bin', data: Buffer.alloc(RATIO_CHECK_FLOOR_BYTES) }]);
      await expectEntryRefused(bytes, 'zip_bomb', 'app/zeros.bin', /unpacks to 1 MB from .*, \d+ times its packed size; the limit is 100 times/);
    });

    it('should refuse a zip whose files together unpack far beyond their packed size', async () => {
      const files = Array.from({ length: 20 }, (_, i) => ({ name: `app/blank-${i}.txt`, data: Buffer.alloc(RATIO_CHECK_FLOOR_BYTES / 16) }));
      const err = await refusalOf(inspect(zipBytes(files)));
      expect(err).toMatchObject({ code: 'zip_bomb', status: 422, details: { limit: 100 } });
      expect(err.message).toMatch(/^Refused zip: its 20 files unpack to 1.3 MB from .*, \d+ times their packed size; the limit is 100 times/);
    });
  });
});
