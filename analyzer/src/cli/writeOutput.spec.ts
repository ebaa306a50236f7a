import { promises as fsp } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { MemoryStream } from './fixtures/memoryStream';
import { OutputError, PENDING_TEMP_FILES, writeChunksToStream, writeFileAtomic } from './writeOutput';

describe('writeFileAtomic', () => {
  let dir: string;
  beforeEach(async () => {
    dir = await fsp.mkdtemp(path.join(os.tmpdir(), 'seamline-out-'));
  });
  afterEach(async () => {
    await fsp.rm(dir, { recursive: true, force: true });
  });

  it('should write all chunks to the target and leave no temporary file', async () => {
    const target = path.join(dir, 'snap.json');
    await writeFileAtomic(target, ['{"a":', '1}']);
    expect(await fsp.readFile(target, 'utf8')).toBe('{"a":1}');
    expect(await fsp.readdir(dir)).toEqual(['snap.json']);
  });

  it('should list the temporary file while it is written, for removal on an interrupt, and only then', async () => {
    const target = path.join(dir, 'snap.json');
    const seen: string[][] = [];
    function* watched(): Generator<string> {
      yield 'a';
      seen.push([...PENDING_TEMP_FILES]);
    }
    await writeFileAtomic(target, watched());
    expect(seen[0]).toHaveLength(1);
    expect(path.dirname(seen[0][0])).toBe(dir);
    expect(PENDING_TEMP_FILES.size).toBe(0);
  });

  it('should leave the previous file untouched when producing the output fails half-way', async () => {
    const target = path.join(dir, 'snap.json');
    await fsp.writeFile(target, 'previous');
    function* failing(): Generator<string> {
      yield 'x'.repeat(3 << 20); // more than one write's batch, so part of it reaches the disk
      throw new Error('serialisation failed');
    }
    await expect(writeFileAtomic(target, failing())).rejects.toThrow('serialisation failed');
    expect(await fsp.readFile(target, 'utf8')).toBe('previous');
    expect(await fsp.readdir(dir)).toEqual(['snap.json']);
  });

  it('should remove the temporary file and keep the target when the rename fails', async () => {
    const target = path.join(dir, 'report.sarif');
    const failingRename = Object.assign(new Error('EXDEV: cross-device link not permitted'), { code: 'EXDEV' });
    const fs = { open: fsp.open, unlink: fsp.unlink, rename: () => Promise.reject(failingRename) };
    await expect(writeFileAtomic(target, ['data'], fs)).rejects.toThrow(OutputError);
    expect(await fsp.readdir(dir)).toEqual([]);
  });

  it('should explain a missing folder without naming the temporary file', async () => {
    const target = path.join(dir, 'missing', 'snap.json');
    const error = await writeFileAtomic(target, ['x']).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(OutputError);
    expect((error as OutputError).reason).toBe(`the folder ${path.join(dir, 'missing')} does not exist`);
    expect((error as OutputError).message).not.toContain('.tmp');
  });

  it('should refuse to replace a folder and leave nothing behind', async () => {
    await fsp.mkdir(path.join(dir, 'out'));
    await expect(writeFileAtomic(path.join(dir, 'out'), ['x'])).rejects.toThrow(OutputError);
    expect(await fsp.readdir(dir)).toEqual(['out']);
  });
});

describe('writeChunksToStream', () => {
  it('should deliver every chunk in order through back-pressure', async () => {
    const stream = new MemoryStream(true);
    const chunks = Array.from({ length: 2000 }, (_, i) => `${i},`);
    let refused = 0;
    const write = stream.write.bind(stream);
    stream.write = ((chunk: string) => {
      const accepted = write(chunk);
      if (!accepted) refused++;
      return accepted;
    }) as typeof stream.write;
    await writeChunksToStream(stream, chunks);
    await new Promise<void>((resolve) => stream.end(resolve));
    expect(stream.text).toBe(chunks.join(''));
    expect(refused).toBeGreaterThan(0);
  });
});
