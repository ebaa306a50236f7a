import { mkdir, mkdtemp, readdir, readFile, rm, symlink, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import { SafeTreeWriter } from './safe-tree-writer';

describe('SafeTreeWriter', () => {
  let dir: string;
  beforeEach(async () => {
    dir = await mkdtemp(join(tmpdir(), 'seamline-tree-'));
  });
  afterEach(() => rm(dir, { recursive: true, force: true }));

  it('should create its root with parents and write files and folders below it', async () => {
    const writer = await SafeTreeWriter.create(join(dir, 'a', 'b', 'out'));
    await writer.file(['src', 'main.ts'], Readable.from([Buffer.from('main();')]));
    await writer.folder(['src', 'empty']);
    expect(await readFile(join(dir, 'a/b/out/src/main.ts'), 'utf8')).toBe('main();');
    expect((await readdir(join(dir, 'a/b/out/src'))).sort()).toEqual(['empty', 'main.ts']);
  });

  it('should take an empty folder but refuse a folder with something in it', async () => {
    await mkdir(join(dir, 'empty'));
    await expect(SafeTreeWriter.create(join(dir, 'empty'))).resolves.toBeInstanceOf(SafeTreeWriter);
    await mkdir(join(dir, 'full'));
    await writeFile(join(dir, 'full', 'keep.txt'), 'keep');
    await expect(SafeTreeWriter.create(join(dir, 'full'))).rejects.toThrow(/already exists and is not an empty folder/);
    expect(await readFile(join(dir, 'full', 'keep.txt'), 'utf8')).toBe('keep');
  });

  it('should refuse a root that is a link to a folder', async () => {
    await mkdir(join(dir, 'real'));
    await symlink(join(dir, 'real'), join(dir, 'link'));
    await expect(SafeTreeWriter.create(join(dir, 'link'))).rejects.toThrow(/not an empty folder/);
  });

  it('should never write through a link planted in its tree', async () => {
    const writer = await SafeTreeWriter.create(join(dir, 'out'));
    await mkdir(join(dir, 'elsewhere'));
    await symlink(join(dir, 'elsewhere'), join(dir, 'out', 'app'));
    await expect(writer.file(['app', 'x.ts'], Readable.from([Buffer.from('x')]))).rejects.toThrow(/something is already there/);
    await symlink(join(dir, 'elsewhere', 'target.ts'), join(dir, 'out', 'x.ts'));
    await expect(writer.file(['x.ts'], Readable.from([Buffer.from('x')]))).rejects.toMatchObject({ code: 'EEXIST' });
    expect(await readdir(join(dir, 'elsewhere'))).toEqual([]);
  });

  it('should refuse a target outside its root', async () => {
    const writer = await SafeTreeWriter.create(join(dir, 'out'));
    await expect(writer.file(['..', 'escaped.ts'], Readable.from([Buffer.from('x')]))).rejects.toThrow(/is not inside/);
    await expect(writer.folder(['..'])).rejects.toThrow(/is not inside/);
    expect((await readdir(dir)).sort()).toEqual(['out']);
  });
});
