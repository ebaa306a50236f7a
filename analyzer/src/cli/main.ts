/**
 * The `seamline` command line
 * ===========================
 * `runCli` parses the arguments, runs one command and returns its exit code: 0 fine, 1 `check`
 * listed functions over the limit, 2 a usage or input error (one clear message on stderr), 3 an
 * unexpected failure (message and stack on stderr). It never calls `process.exit`, so tests
 * drive it with in-memory streams; `runFromProcess` wires it to the real process (the bin uses it).
 */
import { rmSync } from 'node:fs';
import type { Writable } from 'node:stream';
import { IncomparableSnapshotsError } from '../check/IncomparableSnapshotsError';
import { analyzerVersion } from '../project/analyzerVersion';
import { DEFAULT_DEPENDENCIES } from './cliDependencies';
import type { CliDependencies } from './cliDependencies';
import { CliInputError } from './CliInputError';
import { CHECK_HELP, MAIN_HELP, SCAN_HELP } from './helpText';
import { parseCommandLine } from './parseCommandLine';
import { PUSH_HELP } from './pushHelpText';
import { runScan } from './runScan';
import { UsageError } from './UsageError';
import { OutputError, PENDING_TEMP_FILES } from './writeOutput';

/** Exit codes of every command. */
export const EXIT = { ok: 0, breach: 1, usage: 2, failure: 3 } as const;

/** Where the CLI writes, where relative paths start, and whether stderr is a terminal. */
export interface CliIo {
  stdout: Writable;
  stderr: Writable;
  cwd: string;
  /** Whether stderr is a terminal (draws the progress bar in place). */
  isTTY?: boolean;
  /** Environment variables (push reads its token from SEAMLINE_TOKEN); default process.env. */
  env?: NodeJS.ProcessEnv;
}

const HELP = { scan: SCAN_HELP, check: CHECK_HELP, push: PUSH_HELP } as const;

// Which command's name prefixes an error, when the command line got that far.
function commandOf(argv: readonly string[]): string {
  return argv[0] === 'scan' || argv[0] === 'check' || argv[0] === 'push' ? `seamline ${argv[0]}` : 'seamline';
}

function report(error: unknown, argv: readonly string[], io: CliIo, deps: CliDependencies): number {
  const prefix = commandOf(argv);
  if (error instanceof UsageError) {
    io.stderr.write(`${prefix}: ${error.reason}\n${error.hint}\n`);
    return EXIT.usage;
  }
  if (error instanceof CliInputError) {
    io.stderr.write(`${prefix}: ${error.reason}\n`);
    return EXIT.usage;
  }
  if (error instanceof OutputError) {
    io.stderr.write(`${prefix}: cannot write ${error.file}: ${error.reason}\n`);
    return EXIT.usage;
  }
  if (error instanceof IncomparableSnapshotsError) {
    io.stderr.write(
      `${prefix}: the snapshot and the baseline were counted under different settings (${error.differences.join('; ')}), ` +
        `so their V(G) values are not comparable; scan both with the same settings\n`,
    );
    return EXIT.usage;
  }
  if (deps.isScanInputError(error)) {
    io.stderr.write(`${prefix}: ${(error as Error).message}\n`);
    return EXIT.usage;
  }
  const detail = error instanceof Error ? (error.stack ?? error.message) : String(error);
  io.stderr.write(`${prefix}: unexpected failure (please report it with the command line):\n${detail}\n`);
  return EXIT.failure;
}

/** Run the CLI with `argv` (without node and the script); resolves to the exit code. */
export async function runCli(argv: string[], io: CliIo, deps: Partial<CliDependencies> = {}): Promise<number> {
  const dependencies: CliDependencies = { ...DEFAULT_DEPENDENCIES, ...deps };
  try {
    const command = parseCommandLine(argv, io.env ?? process.env);
    switch (command.kind) {
      case 'help':
        io.stdout.write(command.topic ? HELP[command.topic] : MAIN_HELP);
        return EXIT.ok;
      case 'version':
        io.stdout.write(`${analyzerVersion()}\n`);
        return EXIT.ok;
      case 'scan':
        return await runScan(command, io, dependencies);
      case 'check':
        // Loaded on use: reading snapshots compiles the JSON Schema (~0.2 s), which a scan never needs.
        return await (require('./runCheck') as typeof import('./runCheck')).runCheck(command, io);
      case 'push':
        // Loaded on use, like check: it validates the snapshot before sending it.
        return await (require('./pushSnapshot') as typeof import('./pushSnapshot')).runPush(command, io);
    }
  } catch (error) {
    return report(error, argv, io, dependencies);
  }
}

/** Run the CLI as the `seamline` process: real streams, exit code on `process.exitCode`. */
export function runFromProcess(): Promise<void> {
  // A reader that goes away (`seamline scan . | head`) is not an error worth a stack trace.
  process.stdout.on('error', (error: NodeJS.ErrnoException) => {
    if (error.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw error;
  });
  // Interrupted during --out: the target is untouched; remove the temporary file too.
  for (const [signal, code] of [['SIGINT', 130], ['SIGTERM', 143]] as const) {
    process.once(signal, () => {
      for (const temp of PENDING_TEMP_FILES) rmSync(temp, { force: true });
      process.exit(code);
    });
  }
  return runCli(process.argv.slice(2), {
    stdout: process.stdout,
    stderr: process.stderr,
    cwd: process.cwd(),
    isTTY: process.stderr.isTTY === true,
  }).then((code) => {
    process.exitCode = code;
  });
}

if (require.main === module) void runFromProcess();
