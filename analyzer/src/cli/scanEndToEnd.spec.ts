// The CLI over the real scanner: a small folder of TypeScript written here, scanned to JSON,
// SARIF and CSV, with the JSON validated against docs/snapshot.schema.json.
import { promises as fsp } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { parseSnapshot } from '../snapshot/parseSnapshot';
import { snapshotSchemaProblems } from '../snapshot/validateSnapshot';
import { MemoryStream } from './fixtures/memoryStream';
import { runCli } from './main';

// 11 ifs in a row: V = 12 (McCabe 1976, IEEE TSE SE-2(4): sequential if-then constructs add one each).
const BRANCHY = `export function grade(n: number): string {
${Array.from({ length: 11 }, (_, i) => `  if (n === ${i}) return 'g${i}';`).join('\n')}
  return 'other';
}
`;

// if-then-else: V = 2 (McCabe 1976); a sequence: V = 1.
const SMALL = `export class Orders {
  assign(id: string): string {
    if (id) {
      return id;
    } else {
      return 'none';
    }
  }
}
export const same = (x: number) => x + 1;
`;

let root: string;
beforeAll(async () => {
  root = await fsp.mkdtemp(path.join(os.tmpdir(), 'seamline-e2e-'));
  await fsp.mkdir(path.join(root, 'proj', 'src'), { recursive: true });
  await fsp.writeFile(path.join(root, 'proj', 'src', 'grade.ts'), BRANCHY);
  await fsp.writeFile(path.join(root, 'proj', 'src', 'orders.ts'), SMALL);
  await fsp.writeFile(path.join(root, 'proj', 'src', 'types.d.ts'), 'export type Id = string;\n');
});
afterAll(async () => {
  await fsp.rm(root, { recursive: true, force: true });
});

async function run(argv: string[]) {
  const stdout = new MemoryStream();
  const stderr = new MemoryStream();
  const code = await runCli(argv, { stdout, stderr, cwd: root, isTTY: false });
  return { code, stdout: stdout.text, stderr: stderr.text };
}

describe('seamline scan over the real scanner', () => {
  it('should write a snapshot that the JSON Schema accepts, with the expected V(G)', async () => {
    const result = await run(['scan', 'proj', '--out', 'snap.json']);
    expect(result.stderr).toMatch(/^scanned 2 files \(1 skipped\) · \d+ functions · ΣV \d+ · \d+ decisions · 1 over the limit of 10 \(rule of thumb, not a verdict\) · wrote snap\.json\ncalls: \d+ sites? resolved to \d+ edges? · \d+ unresolved · \d+ into external code[^\n]*\n$/);
    expect(result.code).toBe(0);
    const value = JSON.parse(await fsp.readFile(path.join(root, 'snap.json'), 'utf8'));
    expect(snapshotSchemaProblems(value)).toEqual([]);
    const snapshot = parseSnapshot(JSON.stringify(value), 'snap.json');
    expect(snapshot.root).toBe('proj');
    const byName = new Map(snapshot.functions.map((f) => [f.qualifiedName, f]));
    expect(byName.get('grade')?.cyclomatic).toBe(12);
    expect(byName.get('Orders.assign')?.cyclomatic).toBe(2);
    expect(snapshot.files.skipped).toEqual([expect.objectContaining({ file: 'src/types.d.ts', reason: 'declaration' })]);
  });

  it('should flag the one function over the limit in SARIF, at its file and line', async () => {
    const result = await run(['scan', 'proj', '--format', 'sarif']);
    expect(result.code).toBe(0);
    const log = JSON.parse(result.stdout);
    expect(log.runs[0].results).toHaveLength(1);
    const location = log.runs[0].results[0].locations[0].physicalLocation;
    expect(location.artifactLocation.uri).toBe('src/grade.ts');
    expect(location.region).toEqual({ startLine: 1, endLine: 14 });
  });

  it('should list every function in CSV, flagging the one over the limit', async () => {
    const result = await run(['scan', 'proj', '--format', 'csv', '--limit', '11']);
    const rows = result.stdout.trimEnd().split('\r\n').map((line) => line.split(','));
    const header = rows[0];
    const grade = rows.find((r) => r[header.indexOf('qualifiedName')] === 'grade')!;
    expect(grade[header.indexOf('cyclomatic')]).toBe('12');
    expect(grade[header.indexOf('overLimit')]).toBe('true');
    expect(rows.filter((r) => r[header.indexOf('overLimit')] === 'true')).toHaveLength(1);
  });

  it('should pass check on its own snapshot only when the limit allows it', async () => {
    await run(['scan', 'proj', '--out', 'check.json']);
    expect((await run(['check', 'check.json'])).code).toBe(1);
    expect((await run(['check', 'check.json', '--limit', '12'])).code).toBe(0);
  });

  it('should refuse a missing folder and an unreadable tsconfig with exit 2', async () => {
    const missing = await run(['scan', 'nowhere']);
    expect(missing.code).toBe(2);
    expect(missing.stderr).toMatch(/^seamline scan: .*nowhere/);
    await fsp.writeFile(path.join(root, 'broken.json'), '{ "compilerOptions": ');
    const broken = await run(['scan', 'proj', '--tsconfig', 'broken.json']);
    expect(broken.code).toBe(2);
    expect(broken.stderr).toMatch(/^seamline scan: .*broken\.json/);
  });
});
