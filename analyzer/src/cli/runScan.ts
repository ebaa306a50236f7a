/**
 * `seamline scan`
 * ===============
 * Scans a folder, optionally imports a coverage report, and writes the snapshot (JSON), SARIF or
 * the functions table (CSV) to stdout or, atomically, to `--out`. Progress and the closing summary
 * go to stderr, so stdout carries nothing but the machine output. Inputs that would only fail
 * after a long scan (the coverage report, the output folder) are checked first.
 */
import { promises as fsp } from 'node:fs';
import path from 'node:path';
import type { Writable } from 'node:stream';
import { clustersCsv } from '../formats/clustersCsv';
import { functionsCsv } from '../formats/functionsCsv';
import { toGraphml } from '../formats/graphml';
import { modulesCsv } from '../formats/modulesCsv';
import { toSarif } from '../formats/toSarif';
import type { Snapshot } from '../model/Snapshot';
import { snapshotJsonChunks } from '../snapshot/snapshotJsonChunks';
import type { CliDependencies } from './cliDependencies';
import { CliInputError } from './CliInputError';
import { formatCallSummary, formatSummary } from './formatSummary';
import type { ScanCommand } from './parseCommandLine';
import { ProgressReporter } from './ProgressReporter';
import { readInputFile } from './readInputFile';
import { writeChunksToStream, writeFileAtomic } from './writeOutput';

/** The streams and folder a command runs with. */
export interface CommandIo {
  stdout: Writable;
  stderr: Writable;
  cwd: string;
  isTTY?: boolean;
}

/** The machine output of a scan, as chunks. */
export function* scanOutputChunks(snapshot: Snapshot, command: Pick<ScanCommand, 'format' | 'pretty' | 'table' | 'level'>): Generator<string> {
  if (command.format === 'csv') {
    if (command.table === 'modules') yield* modulesCsv(snapshot, command.level);
    else if (command.table === 'clusters') yield* clustersCsv(snapshot, command.level);
    else yield* functionsCsv(snapshot);
  } else if (command.format === 'graphml') {
    yield toGraphml(snapshot, command.level);
  } else if (command.format === 'sarif') {
    yield `${JSON.stringify(toSarif(snapshot), null, command.pretty ? 2 : undefined)}\n`;
  } else {
    yield* snapshotJsonChunks(snapshot, { pretty: command.pretty });
    if (!command.pretty) yield '\n';
  }
}

async function checkOutputFolder(out: string, shownAs: string): Promise<void> {
  const folder = path.dirname(out);
  const stat = await fsp.stat(folder).catch(() => undefined);
  if (!stat?.isDirectory()) throw new CliInputError(`cannot write ${shownAs}: the folder ${path.dirname(shownAs)} does not exist`);
}

/** Run `seamline scan`; returns the exit code (0), throwing typed errors for the caller to report. */
export async function runScan(command: ScanCommand, io: CommandIo, deps: CliDependencies): Promise<number> {
  const resolve = (p: string) => path.resolve(io.cwd, p);
  const out = command.out === undefined ? undefined : resolve(command.out);
  if (out !== undefined) await checkOutputFolder(out, command.out!);
  const report = command.coverage === undefined ? undefined : await readInputFile(resolve(command.coverage), 'coverage report', command.coverage);

  const progress = new ProgressReporter({ stream: io.stderr, isTTY: io.isTTY ?? false, now: deps.now });
  let snapshot: Snapshot;
  try {
    snapshot = await deps.scanDirectory(
      resolve(command.dir),
      {
        settings: command.settings,
        tsconfig: command.tsconfig === undefined ? undefined : resolve(command.tsconfig),
        embedSource: command.embedSource,
        maxLineLength: command.maxLineLength,
        threads: command.threads,
        calls: command.calls,
        mapSettings: command.mapSettings,
      },
      (event) => progress.update(event),
    );
  } finally {
    progress.finish();
  }

  if (report !== undefined) {
    try {
      snapshot = deps.importCoverage(snapshot, report);
    } catch (error) {
      const reason = (error as Error).message.replace(/^analyzer\/[\w/-]+: /, '');
      throw new CliInputError(`cannot use coverage report ${command.coverage}: ${reason}`);
    }
  }

  const chunks = scanOutputChunks(snapshot, command);
  if (out === undefined) await writeChunksToStream(io.stdout, chunks);
  else await writeFileAtomic(out, chunks);
  io.stderr.write(`${formatSummary(snapshot)}${command.out === undefined ? '' : ` · wrote ${command.out}`}\n`);
  const calls = formatCallSummary(snapshot);
  if (calls) io.stderr.write(`${calls}\n`);
  return 0;
}
