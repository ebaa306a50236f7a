import { promises as fsp, readFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Snapshot } from '../model';
import { ScanInputError } from '../project/ScanInputError';
import { syntheticFunction, syntheticSnapshot } from '../snapshot/fixtures/syntheticSnapshot';
import { parseSnapshot } from '../snapshot/parseSnapshot';
import type { CliDependencies } from './cliDependencies';
import { MemoryStream } from './fixtures/memoryStream';
import { CHECK_HELP, MAIN_HELP, SCAN_HELP } from './helpText';
import { runCli } from './main';

let dir: string;
beforeEach(async () => {
  dir = await fsp.mkdtemp(path.join(os.tmpdir(), 'seamline-cli-'));
});
afterEach(async () => {
  await fsp.rm(dir, { recursive: true, force: true });
});

async function run(argv: string[], deps: Partial<CliDependencies> = {}, isTTY = false) {
  const stdout = new MemoryStream();
  const stderr = new MemoryStream();
  const code = await runCli(argv, { stdout, stderr, cwd: dir, isTTY }, deps);
  return { code, stdout: stdout.text, stderr: stderr.text };
}

const sample = () =>
  syntheticSnapshot([
    syntheticFunction({ cyclomatic: 3, line: 1, file: 'src/a.ts' }),
    syntheticFunction({ cyclomatic: 14, line: 20, file: 'src/a.ts', qualifiedName: 'Orders.assign' }),
    syntheticFunction({ cyclomatic: 12, line: 5, file: 'src/b.ts', qualifiedName: 'route' }),
  ]);

/** A scanner stand-in that records what it was asked and reports some progress. */
function fakeScanner(result: () => Snapshot = sample) {
  const calls: { dir: string; options: unknown }[] = [];
  const scanDirectory: CliDependencies['scanDirectory'] = async (scanDir, options, onProgress) => {
    calls.push({ dir: scanDir, options });
    onProgress?.({ phase: 'discover', done: 2, total: 2 });
    onProgress?.({ phase: 'analyse', done: 1, total: 2, file: 'src/a.ts' });
    onProgress?.({ phase: 'analyse', done: 2, total: 2, file: 'src/b.ts' });
    return { ...result(), settings: { ...options.settings } };
  };
  return { calls, scanDirectory };
}

describe('runCli: help and version', () => {
  it.each<[string[], string]>([
    [['--help'], MAIN_HELP],
    [['help'], MAIN_HELP],
    [['scan', '--help'], SCAN_HELP],
    [['check', '-h'], CHECK_HELP],
  ])('should print the usage for %j on stdout and exit 0', async (argv, text) => {
    expect(await run(argv)).toEqual({ code: 0, stdout: text, stderr: '' });
  });

  it('should mention the caution in the help', () => {
    expect(SCAN_HELP).toContain('rule of thumb');
    expect(CHECK_HELP).toContain('teams commonly allow up to 15 with a reason');
  });

  it("should print the root package's version", async () => {
    const pkg = JSON.parse(readFileSync(path.join(__dirname, '../../../package.json'), 'utf8')) as { version: string };
    expect(await run(['--version'])).toEqual({ code: 0, stdout: `${pkg.version}\n`, stderr: '' });
  });
});

describe('runCli: usage errors', () => {
  it.each<[string[], string]>([
    [[], 'seamline: no command given (scan, check or push)\nRun `seamline --help` for usage.\n'],
    [['lint'], "seamline: unknown command 'lint': the commands are scan, check and push\nRun `seamline --help` for usage.\n"],
    [['scan', 'src', '--bogus'], 'seamline scan: unknown option --bogus\nRun `seamline scan --help` for usage.\n'],
    [['scan', 'src', '--out'], 'seamline scan: option --out needs a value\nRun `seamline scan --help` for usage.\n'],
    [['scan', 'src', '--format', 'yaml'], "seamline scan: --format must be json or sarif or csv or graphml, got 'yaml'\nRun `seamline scan --help` for usage.\n"],
    [['scan', 'src', '--limit', 'lots'], "seamline scan: --limit must be a whole number of at least 1, got 'lots'\nRun `seamline scan --help` for usage.\n"],
    [['scan', 'src', '--format', 'csv', '--table', 'modules', '--no-calls'], 'seamline scan: --table modules needs the module map, which --no-calls turns off\nRun `seamline scan --help` for usage.\n'],
    [['check'], 'seamline check: missing snapshot file to check\nRun `seamline check --help` for usage.\n'],
  ])('should exit 2 for %j with one line and a hint, and write nothing on stdout', async (argv, message) => {
    const scanner = fakeScanner();
    expect(await run(argv, { scanDirectory: scanner.scanDirectory })).toEqual({ code: 2, stdout: '', stderr: message });
    expect(scanner.calls).toEqual([]);
  });
});

describe('runCli scan (with a stand-in scanner)', () => {
  it('should pass the folder, tsconfig and counting settings to the scanner, resolved from the working folder', async () => {
    const scanner = fakeScanner();
    await run(['scan', 'app', '--tsconfig', 'app/tsconfig.json', '--switch', 'one', '--limit', '15', '--embed-source', '--no-calls'], scanner);
    expect(scanner.calls).toEqual([
      {
        dir: path.join(dir, 'app'),
        options: {
          settings: { switch: 'one', optionalChaining: false, defaultValues: false, limit: 15 },
          tsconfig: path.join(dir, 'app/tsconfig.json'),
          embedSource: true,
          maxLineLength: undefined,
          threads: undefined,
          calls: false,
          mapSettings: {},
        },
      },
    ]);
  });

  it('should write a schema-valid snapshot on stdout and the summary on stderr', async () => {
    const result = await run(['scan', 'app'], fakeScanner());
    expect(result.code).toBe(0);
    const snapshot = parseSnapshot(result.stdout, 'stdout');
    expect(snapshot.functions.map((f) => f.cyclomatic)).toEqual([3, 14, 12]);
    expect(result.stdout.split('\n')).toHaveLength(2); // compact: one line and its newline
    expect(result.stderr).toBe(
      'scanned 2 files · 3 functions · ΣV 29 · 26 decisions · 2 over the limit of 10 (rule of thumb, not a verdict)\n',
    );
  });

  it('should indent the snapshot with --pretty', async () => {
    const result = await run(['scan', 'app', '--pretty'], fakeScanner());
    expect(result.stdout).toBe(`${JSON.stringify(JSON.parse(result.stdout), null, 2)}\n`);
  });

  it('should draw progress on a terminal and erase it before the summary', async () => {
    const result = await run(['scan', 'app'], fakeScanner(), true);
    expect(result.stderr).toMatch(/^\rfinding files… 2\x1b\[K/);
    expect(result.stderr).toContain('\ranalysing 2/2 files ▕████████████████████▏ 100%\x1b[K');
    expect(result.stderr).toMatch(/\r\x1b\[Kscanned 2 files/);
  });

  it('should write SARIF with one result per function over the limit', async () => {
    const result = await run(['scan', 'app', '--format', 'sarif'], fakeScanner());
    const log = JSON.parse(result.stdout);
    expect(log.version).toBe('2.1.0');
    expect(log.runs[0].results.map((r: any) => r.locations[0].physicalLocation.artifactLocation.uri)).toEqual(['src/a.ts', 'src/b.ts']);
  });

  it('should write the functions table as CSV', async () => {
    const result = await run(['scan', 'app', '--format', 'csv', '--table', 'functions'], fakeScanner());
    const lines = result.stdout.split('\r\n');
    expect(lines[0]).toMatch(/^id,file,qualifiedName,kind,line,endLine,loc,cyclomatic,/);
    expect(lines).toHaveLength(5); // header, three rows, and the empty string after the last CRLF
  });

  it('should write --out atomically and keep stdout empty', async () => {
    const result = await run(['scan', 'app', '-o', 'snap.json'], fakeScanner());
    expect(result.code).toBe(0);
    expect(result.stdout).toBe('');
    expect(result.stderr).toMatch(/ · wrote snap\.json\n$/);
    parseSnapshot(await fsp.readFile(path.join(dir, 'snap.json'), 'utf8'), 'snap.json');
    expect(await fsp.readdir(dir)).toEqual(['snap.json']);
  });

  it('should keep the previous --out file when writing the output fails', async () => {
    await fsp.writeFile(path.join(dir, 'snap.json'), 'previous');
    const unserialisable = () => {
      const snapshot = sample();
      (snapshot.functions[2] as unknown as Record<string, unknown>).weight = BigInt(1); // JSON.stringify throws on BigInt
      return snapshot;
    };
    const result = await run(['scan', 'app', '--out', 'snap.json'], fakeScanner(unserialisable));
    expect(result.code).toBe(3);
    expect(result.stderr).toMatch(/^seamline scan: unexpected failure .*\n.*BigInt/);
    expect(await fsp.readFile(path.join(dir, 'snap.json'), 'utf8')).toBe('previous');
    expect(await fsp.readdir(dir)).toEqual(['snap.json']);
  });

  it('should refuse an --out folder that does not exist before scanning', async () => {
    const scanner = fakeScanner();
    const result = await run(['scan', 'app', '--out', 'reports/snap.json'], scanner);
    expect(result).toEqual({ code: 2, stdout: '', stderr: 'seamline scan: cannot write reports/snap.json: the folder reports does not exist\n' });
    expect(scanner.calls).toEqual([]);
  });

  it("should report the scanner's input errors with exit 2", async () => {
    const scanDirectory = () => Promise.reject(new ScanInputError(`No such folder: ${path.join(dir, 'nope')}`));
    const result = await run(['scan', 'nope'], { scanDirectory });
    expect(result).toEqual({ code: 2, stdout: '', stderr: `seamline scan: No such folder: ${path.join(dir, 'nope')}\n` });
  });

  it('should report an unexpected failure with exit 3 and its stack', async () => {
    const scanDirectory = () => Promise.reject(new TypeError('cannot read properties of undefined'));
    const result = await run(['scan', 'app'], { scanDirectory });
    expect(result.code).toBe(3);
    expect(result.stderr).toMatch(/^seamline scan: unexpected failure \(please report it with the command line\):\nTypeError: cannot read/);
  });

  it('should read the coverage report first and hand its text to the importer', async () => {
    await fsp.writeFile(path.join(dir, 'lcov.info'), 'TN:\nend_of_record\n');
    const seen: string[] = [];
    const importCoverage: CliDependencies['importCoverage'] = (snapshot, text) => {
      seen.push(text);
      return {
        ...snapshot,
        coverage: { format: 'lcov', unmatchedFiles: [] },
        functions: snapshot.functions.map((f) => ({ ...f, coverage: { outcomesCovered: 0, outcomesTotal: 2 * f.decisions, outcomes: [], actualComplexity: 1, untestedPaths: f.cyclomatic - 1, crap: 1 } })),
      };
    };
    const result = await run(['scan', 'app', '--coverage', 'lcov.info', '--format', 'csv'], { ...fakeScanner(), importCoverage });
    expect(result.code).toBe(0);
    expect(seen).toEqual(['TN:\nend_of_record\n']);
    expect(result.stdout.split('\r\n')[0]).toMatch(/,outcomesCovered,outcomesTotal,actualComplexity,untestedPaths,crap$/);
  });

  it('should refuse a missing coverage report before scanning', async () => {
    const scanner = fakeScanner();
    const result = await run(['scan', 'app', '--coverage', 'missing.info'], scanner);
    expect(result).toEqual({ code: 2, stdout: '', stderr: 'seamline scan: cannot read coverage report missing.info: no such file\n' });
    expect(scanner.calls).toEqual([]);
  });

  it("should report the importer's complaint about a report with exit 2", async () => {
    await fsp.writeFile(path.join(dir, 'cov.json'), '{}');
    const importCoverage = () => {
      throw new Error('analyzer/coverage: neither lcov nor Istanbul JSON');
    };
    const result = await run(['scan', 'app', '--coverage', 'cov.json'], { ...fakeScanner(), importCoverage });
    expect(result).toEqual({ code: 2, stdout: '', stderr: 'seamline scan: cannot use coverage report cov.json: neither lcov nor Istanbul JSON\n' });
  });
});

describe('runCli check', () => {
  async function write(name: string, snapshot: Snapshot | string): Promise<string> {
    await fsp.writeFile(path.join(dir, name), typeof snapshot === 'string' ? snapshot : JSON.stringify(snapshot));
    return name;
  }

  it('should exit 0 and say so when nothing is over the limit', async () => {
    const file = await write('snap.json', syntheticSnapshot([syntheticFunction({ cyclomatic: 10 })]));
    expect(await run(['check', file])).toEqual({
      code: 0,
      stdout: 'no function over the limit of 10 (rule of thumb, not a verdict); 1 function checked\n',
      stderr: '',
    });
  });

  it('should exit 1 and list the functions over the limit, largest first', async () => {
    const file = await write('snap.json', sample());
    expect(await run(['check', file])).toEqual({
      code: 1,
      stdout: [
        'src/a.ts:20  Orders.assign  V(G)=14',
        'src/b.ts:5  route  V(G)=12',
        '2 functions over the limit of 10 (rule of thumb, not a verdict)',
        '',
      ].join('\n'),
      stderr: '',
    });
  });

  it("should take --limit over the snapshot's own", async () => {
    const file = await write('snap.json', sample());
    expect((await run(['check', file, '--limit', '15'])).code).toBe(0);
    expect((await run(['check', file, '--limit', '12'])).stdout).toMatch(/^src\/a\.ts:20 {2}Orders\.assign {2}V\(G\)=14\n1 function over the limit of 12/);
  });

  it("should use the snapshot's own limit when no --limit is given", async () => {
    const file = await write('snap.json', syntheticSnapshot(sample().functions, { limit: 13 }));
    expect((await run(['check', file])).stdout).toMatch(/^src\/a\.ts:20 .*\n1 function over the limit of 13/);
  });

  it('should report only new or worsened functions against a baseline', async () => {
    const before = syntheticSnapshot([
      syntheticFunction({ cyclomatic: 14, line: 20, file: 'src/a.ts', qualifiedName: 'Orders.assign' }),
      syntheticFunction({ cyclomatic: 9, line: 5, file: 'src/b.ts', qualifiedName: 'route' }),
    ]);
    const snap = await write('snap.json', sample());
    const old = await write('old.json', before);
    expect(await run(['check', snap, '--baseline', old])).toEqual({
      code: 1,
      stdout: 'src/b.ts:5  route  V(G)=12  (was 9)\n1 function new or worse over the limit of 10 (rule of thumb, not a verdict); 1 already over it in the baseline and not worse\n',
      stderr: '',
    });
    const same = await write('same.json', sample());
    expect(await run(['check', snap, '--baseline', same])).toEqual({
      code: 0,
      stdout: 'no function new or worse over the limit of 10 (rule of thumb, not a verdict); 2 already over it in the baseline and not worse\n',
      stderr: '',
    });
  });

  it('should exit 2 when the baseline was counted under other settings', async () => {
    const snap = await write('snap.json', sample());
    const old = await write('old.json', syntheticSnapshot(sample().functions, { switch: 'one' }));
    const result = await run(['check', snap, '--baseline', old]);
    expect(result.code).toBe(2);
    expect(result.stderr).toBe(
      'seamline check: the snapshot and the baseline were counted under different settings (switch: one → cases), so their V(G) values are not comparable; scan both with the same settings\n',
    );
  });

  it.each<[string, string, RegExp]>([
    ['missing file', '', /^seamline check: cannot read snapshot absent\.json: no such file\n$/],
    ['broken JSON', '{"schema": ', /^seamline check: absent\.json is not valid JSON/],
    ['another schema version', '{"schema": "seamline/snapshot@9"}', /^seamline check: absent\.json is a "seamline\/snapshot@9" file/],
    ['schema problems', JSON.stringify({ ...sample(), totals: undefined }), /^seamline check: absent\.json does not match the snapshot schema \(1 problem\):\n {2}\(top level\): missing required property 'totals'\n$/],
  ])('should exit 2 naming the file for a %s', async (name, content, message) => {
    if (name !== 'missing file') await write('absent.json', content);
    const result = await run(['check', 'absent.json']);
    expect(result.code).toBe(2);
    expect(result.stdout).toBe('');
    expect(result.stderr).toMatch(message);
  });

  it('should name the baseline when it is the broken file', async () => {
    const snap = await write('snap.json', sample());
    const result = await run(['check', snap, '--baseline', 'old.json']);
    expect(result).toEqual({ code: 2, stdout: '', stderr: 'seamline check: cannot read baseline old.json: no such file\n' });
  });
});
