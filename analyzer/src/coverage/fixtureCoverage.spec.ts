/**
 * A real coverage run: jest instruments the fixture project (TypeScript through @swc/jest with
 * inline source maps, so counts land on the TypeScript lines), its test runs only some branches,
 * and both reports it writes (lcov and Istanbul JSON) are mapped onto the graphs our builder
 * makes of the same functions. Every expected value is derived by hand from what
 * fixtures/sample.fixture-test.ts calls; V(G) = decisions + 1 (McCabe 1976, IEEE TSE SE-2(4)),
 * CRAP = V² × (1 − cov)³ + V (Savoia 2007, reference-checks §7).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { ts } from 'ts-morph';
import { buildFlowGraph } from '../cfg/buildFlowGraph';
import { DEFAULT_SETTINGS, type FunctionCoverage } from '../model';
import { scanDirectory } from '../project/scanDirectory';
import { applyCoverage } from './applyCoverage';
import { importCoverage } from './importCoverage';
import { assignReportFiles } from './assignReportFiles';
import type { CoverageReport, FileCoverage } from './CoverageReport';
import { parseIstanbulJson } from './parseIstanbulJson';
import { parseLcov } from './parseLcov';

const FIXTURE = join(__dirname, 'fixtures');
const REPO = resolve(__dirname, '../../..');

let lcov: CoverageReport;
let istanbul: CoverageReport;
let lcovText: string;

beforeAll(() => {
  const out = mkdtempSync(join(tmpdir(), 'seamline-coverage-'));
  try {
    const run = spawnSync(
      process.execPath,
      [
        join(REPO, 'node_modules/jest/bin/jest.js'),
        '--config', join(FIXTURE, 'jest.config.js'),
        '--rootDir', FIXTURE,
        '--coverage', '--coverageReporters=lcovonly', '--coverageReporters=json',
        '--coverageDirectory', out,
        '--runInBand', '--ci', '--no-cache',
      ],
      { cwd: FIXTURE, encoding: 'utf8', timeout: 25_000 },
    );
    if (run.status !== 0) throw new Error(`fixture jest run failed (${run.status}): ${run.stderr}`);
    lcovText = readFileSync(join(out, 'lcov.info'), 'utf8');
    lcov = parseLcov(lcovText);
    istanbul = parseIstanbulJson(JSON.parse(readFileSync(join(out, 'coverage-final.json'), 'utf8')));
  } finally {
    rmSync(out, { recursive: true, force: true });
  }
}, 30_000);

function coverageOf(report: CoverageReport): FileCoverage {
  const { byFile, unmatchedFiles } = assignReportFiles(report, ['sample.ts', 'sample.fixture-test.ts']);
  expect(unmatchedFiles).toEqual([]);
  return byFile.get('sample.ts')!;
}

function functionCoverage(name: string, file: FileCoverage): FunctionCoverage {
  const text = readFileSync(join(FIXTURE, 'sample.ts'), 'utf8');
  const source = ts.createSourceFile('sample.ts', text, ts.ScriptTarget.Latest, true, ts.ScriptKind.TS);
  const node = source.statements.find((s): s is ts.FunctionDeclaration => ts.isFunctionDeclaration(s) && s.name?.text === name);
  if (!node) throw new Error(`fixture has no function ${name}`);
  const line = source.getLineAndCharacterOfPosition(node.getStart(source)).line + 1;
  const endLine = source.getLineAndCharacterOfPosition(node.end).line + 1;
  const graph = buildFlowGraph(node, source, DEFAULT_SETTINGS);
  return applyCoverage({ graph, kind: 'function', line, endLine }, file);
}

// [function, outcomes per decision in graph order, AC, untested paths, CRAP]
const EXPECTED: [string, [boolean, boolean][], number, number, number][] = [
  // grade(95), grade(10): the first if both ways; `score >= 50` only false. V = 3, one decision
  // covered both ways → AC = 2; cov = 3/4 → CRAP = 9 × (1/4)³ + 3.
  ['grade', [[true, true], [false, true]], 2, 1, 9 / 64 + 3],
  // allowed(true, true, 'x'), allowed(false, true, 'x'): `admin` true and false; `active` only
  // true (so the second && never short-circuited). V = 3, AC = 2, cov = 3/4.
  ['allowed', [[true, true], [true, false]], 2, 1, 9 / 64 + 3],
  // sign(-1): only the `negative` side. V = 2, AC = 1, cov = 1/2 → 4 × 1/8 + 2.
  ['sign', [[true, false]], 1, 1, 2.5],
  // dayKind(6), dayKind(3): case 0 never matches but is passed by both calls; case 6 matches
  // once and is passed once (to the default). V = 3, AC = 2, cov = 3/4.
  ['dayKind', [[false, true], [true, true]], 2, 1, 9 / 64 + 3],
  // total([1, 2]): the body ran and the loop was left. V = 2, AC = 2, cov = 1 → CRAP = V.
  ['total', [[true, true]], 2, 0, 2],
  // readNumber('4'): the try block completed, the handler never ran. V = 2, AC = 1, cov = 1/2.
  ['readNumber', [[false, true]], 1, 1, 2.5],
  // unused: never called. V = 2, AC = 0, cov = 0 → CRAP = 4 + 2.
  ['unused', [[false, false]], 0, 2, 6],
];

describe.each([
  ['lcov', () => lcov],
  ['Istanbul JSON', () => istanbul],
])('coverage of the fixture project from %s', (_format, report) => {
  it.each(EXPECTED)('%s', (name, outcomes, ac, untested, crapScore) => {
    const cov = functionCoverage(name, coverageOf(report()));
    expect(cov.outcomes).toEqual(outcomes);
    expect(cov.outcomesTotal).toBe(2 * outcomes.length);
    expect(cov.outcomesCovered).toBe(outcomes.flat().filter(Boolean).length);
    expect(cov.actualComplexity).toBe(ac);
    expect(cov.untestedPaths).toBe(untested);
    expect(cov.crap).toBeCloseTo(crapScore, 10);
  });
});

it('reads the same branch counts from both reports', () => {
  const counts = (r: CoverageReport) => coverageOf(r).branches.map((b) => [b.line, b.counts]);
  expect(counts(lcov)).toEqual(counts(istanbul));
  expect(coverageOf(istanbul).branches.map((b) => b.type)).toEqual(['if', 'if', 'binary-expr', 'cond-expr', 'switch', 'if']);
});

describe('importing the real report into a scanned snapshot', () => {
  it('should give each function of the covered file the same coverage as mapping it directly', async () => {
    const snapshot = importCoverage(await scanDirectory(FIXTURE, { settings: DEFAULT_SETTINGS, threads: 1 }), lcovText);
    expect(snapshot.coverage).toEqual({ format: 'lcov', unmatchedFiles: [] });
    const grade = snapshot.functions.find((f) => f.file === 'sample.ts' && f.name === 'grade')!;
    expect(grade.coverage).toEqual(functionCoverage('grade', coverageOf(lcov)));
    // The report names the test file too, so its functions are covered; jest.config.js is not in the report.
    expect(snapshot.functions.filter((f) => f.file === 'jest.config.js').every((f) => f.coverage === undefined)).toBe(true);
  });
});
