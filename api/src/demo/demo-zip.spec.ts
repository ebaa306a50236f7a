import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import * as yauzl from 'yauzl';
import { buildDemoZip, DEMO_ROOT, demoFiles, findProjectRoot, type DemoVersion } from './demo-zip';

/** Every entry of a zip with its bytes, read back with an independent reader. */
function readZip(file: string): Promise<Map<string, Buffer>> {
  return new Promise((resolve, reject) => {
    yauzl.open(file, { lazyEntries: true }, (openError, zip) => {
      if (openError || !zip) return reject(openError ?? new Error('no zip'));
      const entries = new Map<string, Buffer>();
      zip.on('error', reject);
      zip.on('end', () => resolve(entries));
      zip.on('entry', (entry: yauzl.Entry) => {
        zip.openReadStream(entry, (streamError, stream) => {
          if (streamError || !stream) return reject(streamError ?? new Error('no stream'));
          const chunks: Buffer[] = [];
          stream.on('data', (chunk: Buffer) => chunks.push(chunk));
          stream.on('error', reject);
          stream.on('end', () => {
            entries.set(entry.fileName, Buffer.concat(chunks));
            zip.readEntry();
          });
        });
      });
      zip.readEntry();
    });
  });
}

describe('the demo zips', () => {
  let scratch: string;

  beforeEach(() => {
    scratch = fs.mkdtempSync(path.join(os.tmpdir(), 'seamline-demo-zip-'));
  });

  afterEach(() => {
    fs.rmSync(scratch, { recursive: true, force: true });
  });

  it('should find the demo codebase in the project', () => {
    expect(DEMO_ROOT).toBe(path.resolve(__dirname, '../../../test/fixtures/otterbay'));
    for (const part of ['README.md', 'before/package.json', 'after/package.json']) expect([part, fs.existsSync(path.join(DEMO_ROOT, part))]).toEqual([part, true]);
  });

  it('should find the project root from the compiled output too, past other package.json files', () => {
    const project = path.join(scratch, 'project');
    fs.mkdirSync(path.join(project, 'dist/server/api/src/demo'), { recursive: true });
    fs.mkdirSync(path.join(project, 'dist/test-server/api/src/demo'), { recursive: true });
    fs.writeFileSync(path.join(project, 'package.json'), JSON.stringify({ name: 'seamline' }));
    fs.writeFileSync(path.join(project, 'dist/server/package.json'), JSON.stringify({ name: 'something-else' }));
    fs.writeFileSync(path.join(project, 'dist/test-server/package.json'), '{ not json');
    expect(findProjectRoot(path.join(project, 'dist/server/api/src/demo'))).toBe(project);
    expect(findProjectRoot(path.join(project, 'dist/test-server/api/src/demo'))).toBe(project);
    expect(() => findProjectRoot(path.join(project, '..'))).toThrow(/holds Seamline's package\.json/);
  });

  it.each<DemoVersion>(['before', 'after'])('should zip %s/ under one top folder, without its coverage report', async (version) => {
    const out = path.join(scratch, `otterbay-${version}.zip`);
    const result = await buildDemoZip(version, out);

    const entries = await readZip(out);
    const expected = demoFiles(version).map((file) => `otterbay-${version}/${file}`);
    expect([...entries.keys()].sort()).toEqual(expected);
    expect(result).toEqual({ files: expected.length, bytes: fs.statSync(out).size });
    expect(result.files).toBeGreaterThan(90);
    // The report exists on disk, so leaving it out is a choice the zip shows.
    expect(fs.existsSync(path.join(DEMO_ROOT, version, 'coverage', 'lcov.info'))).toBe(true);
    expect([...entries.keys()].filter((name) => /(^|\/)(coverage|node_modules)\//.test(name) || name.includes('\\'))).toEqual([]);
    for (const file of ['package.json', 'tsconfig.json']) expect(entries.has(`otterbay-${version}/${file}`)).toBe(true);
    const core = version === 'before' ? 'src/dispatch-core/planDispatch.ts' : 'packages/planner/src/planDispatch.ts';
    expect(entries.get(`otterbay-${version}/${core}`)).toEqual(fs.readFileSync(path.join(DEMO_ROOT, version, core)));
    // Nothing but the finished zip is left behind.
    expect(fs.readdirSync(scratch)).toEqual([`otterbay-${version}.zip`]);
  });

  it('should give the same bytes for the same code', async () => {
    await buildDemoZip('after', path.join(scratch, 'a.zip'));
    await buildDemoZip('after', path.join(scratch, 'b.zip'));
    expect(fs.readFileSync(path.join(scratch, 'a.zip')).equals(fs.readFileSync(path.join(scratch, 'b.zip')))).toBe(true);
  });

  it('should refuse an unknown version and write nothing', async () => {
    const out = path.join(scratch, 'middle.zip');
    await expect(buildDemoZip('middle' as DemoVersion, out)).rejects.toThrow('Unknown demo version "middle": use "before" or "after".');
    expect(fs.readdirSync(scratch)).toEqual([]);
  });

  it('should refuse to write into the demo codebase', async () => {
    const out = path.join(DEMO_ROOT, 'before', 'otterbay-before.zip');
    await expect(buildDemoZip('before', out)).rejects.toThrow(/outside the demo codebase/);
    expect(fs.existsSync(out)).toBe(false);
  });

  it('should say where it could not write, and leave no partial file', async () => {
    fs.writeFileSync(path.join(scratch, 'a-file'), 'not a folder');
    const out = path.join(scratch, 'a-file', 'otterbay-before.zip');
    await expect(buildDemoZip('before', out)).rejects.toThrow(`Could not write the before demo zip to ${out}`);
    expect(fs.readdirSync(scratch)).toEqual(['a-file']);
  });

  it('should remove the partial file when the disk refuses the zip half way', async () => {
    // An existing folder where the zip goes: the data is written, the final rename fails.
    const out = path.join(scratch, 'taken.zip');
    fs.mkdirSync(out);
    fs.writeFileSync(path.join(out, 'keep'), 'x');
    await expect(buildDemoZip('before', out)).rejects.toThrow(`Could not write the before demo zip to ${out}`);
    expect(fs.readdirSync(scratch)).toEqual(['taken.zip']);
    expect(fs.readdirSync(out)).toEqual(['keep']);
  });
});
