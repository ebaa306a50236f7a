/**
 * Parse the command line
 * ======================
 * Turns `argv` (without node and the script) into one command, or throws a `UsageError` with one
 * line that says what is wrong. Options are parsed strictly with node:util `parseArgs`; its
 * errors are reworded (`unknown option --foo`, `option --out needs a value`). `--help` anywhere
 * before `--` wins over every other problem, so a half-typed command can still ask for help.
 *
 * [Reference]: Node.js util.parseArgs; POSIX utility conventions (exit 2 on a usage error, common practice).
 */
import { parseArgs } from 'node:util';
import { DEFAULT_SETTINGS } from '../model/CountingSettings';
import type { CountingSettings } from '../model/CountingSettings';
import type { MapSettings, ModuleLevel } from '../model/ModuleMap';
import { PUSH_OPTIONS, pushCommandFrom } from './pushCommandLine';
import type { PushCommand } from './pushCommandLine';
import { UsageError } from './UsageError';
import type { CommandName } from './UsageError';

/** What `seamline scan` was asked to do. */
export interface ScanCommand {
  kind: 'scan';
  dir: string;
  tsconfig?: string;
  format: 'json' | 'sarif' | 'csv' | 'graphml';
  table: 'functions' | 'modules' | 'clusters';
  /** The module level of `--format graphml` and `--table modules|clusters` (default folder). */
  level: ModuleLevel;
  /** `--folder-depth` and `--resolution`, when given. */
  mapSettings: Partial<MapSettings>;
  out?: string;
  pretty: boolean;
  embedSource: boolean;
  settings: CountingSettings;
  coverage?: string;
  /** False with `--no-calls`. */
  calls: boolean;
  /** Files with a longer line are skipped as minified; 0 turns the check off. */
  maxLineLength?: number;
  /** Worker threads; default one per core. */
  threads?: number;
}

/** What `seamline check` was asked to do. */
export interface CheckCommand {
  kind: 'check';
  snapshot: string;
  /** From `--limit`; absent means the snapshot's own limit. */
  limit?: number;
  baseline?: string;
}

/** Any command line Seamline understands. */
export type CliCommand = ScanCommand | CheckCommand | PushCommand | { kind: 'help'; topic?: CommandName } | { kind: 'version' };

const COMMANDS: readonly string[] = ['scan', 'check', 'push'] satisfies CommandName[];

const SCAN_OPTIONS = {
  tsconfig: { type: 'string' },
  format: { type: 'string', short: 'f' },
  table: { type: 'string' },
  out: { type: 'string', short: 'o' },
  pretty: { type: 'boolean' },
  'embed-source': { type: 'boolean' },
  limit: { type: 'string' },
  switch: { type: 'string' },
  'optional-chaining': { type: 'boolean' },
  'default-values': { type: 'boolean' },
  coverage: { type: 'string' },
  'no-calls': { type: 'boolean' },
  'max-line-length': { type: 'string' },
  threads: { type: 'string' },
  level: { type: 'string' },
  'folder-depth': { type: 'string' },
  resolution: { type: 'string' },
  help: { type: 'boolean', short: 'h' },
} as const;

const CHECK_OPTIONS = {
  limit: { type: 'string' },
  baseline: { type: 'string' },
  help: { type: 'boolean', short: 'h' },
} as const;


function wantsHelp(args: readonly string[]): boolean {
  const end = args.indexOf('--');
  return (end === -1 ? args : args.slice(0, end)).some((a) => a === '--help' || a === '-h');
}

// parseArgs' messages are long and vary by Node version; its error codes do not.
function reword(error: unknown, command: CommandName): UsageError {
  const { code, message } = error as { code?: string; message: string };
  // `Option '-o, --out <value>' argument missing`: name the long form.
  const option = /'(?:-\w, )?(-[^' ,]+)/.exec(message)?.[1];
  if (code === 'ERR_PARSE_ARGS_UNKNOWN_OPTION') return new UsageError(`unknown option ${option ?? message}`, command);
  if (code === 'ERR_PARSE_ARGS_INVALID_OPTION_VALUE' && option) {
    return /does not take/.test(message)
      ? new UsageError(`option ${option} does not take a value`, command)
      : new UsageError(`option ${option} needs a value`, command);
  }
  return new UsageError(message, command);
}

function parse<T extends typeof SCAN_OPTIONS | typeof CHECK_OPTIONS | typeof PUSH_OPTIONS>(args: string[], options: T, command: CommandName) {
  try {
    return parseArgs({ args, options, strict: true, allowPositionals: true });
  } catch (error) {
    throw reword(error, command);
  }
}

function oneOf<V extends string>(value: string, allowed: readonly V[], option: string, command: 'scan' | 'check'): V {
  if ((allowed as readonly string[]).includes(value)) return value as V;
  throw new UsageError(`${option} must be ${allowed.join(' or ')}, got '${value}'`, command);
}

function parseLimit(value: string, command: 'scan' | 'check'): number {
  const n = /^\d+$/.test(value) ? Number(value) : NaN;
  if (!Number.isSafeInteger(n) || n < 1) throw new UsageError(`--limit must be a whole number of at least 1, got '${value}'`, command);
  return n;
}

function parseCount(value: string, option: string, min: number): number {
  const n = /^\d+$/.test(value) ? Number(value) : NaN;
  if (!Number.isSafeInteger(n) || n < min) throw new UsageError(`${option} must be a whole number of at least ${min}, got '${value}'`, 'scan');
  return n;
}

function onePositional(positionals: string[], what: string, command: 'scan' | 'check'): string {
  if (positionals.length === 0) throw new UsageError(`missing ${what}`, command);
  if (positionals.length > 1) {
    throw new UsageError(`expects one ${what}, got ${positionals.length}: ${positionals.join(' ')}`, command);
  }
  return positionals[0];
}

function parseScan(args: string[]): ScanCommand {
  const { values, positionals } = parse(args, SCAN_OPTIONS, 'scan');
  const dir = onePositional(positionals, 'folder to scan', 'scan');
  const format = oneOf(values.format ?? 'json', ['json', 'sarif', 'csv', 'graphml'] as const, '--format', 'scan');
  const table = oneOf(values.table ?? 'functions', ['functions', 'modules', 'clusters'] as const, '--table', 'scan');
  const level = oneOf(values.level ?? 'folder', ['file', 'folder', 'package'] as const, '--level', 'scan');
  if (values.table !== undefined && format !== 'csv') throw new UsageError('--table applies only to --format csv', 'scan');
  if (values.pretty && (format === 'csv' || format === 'graphml')) throw new UsageError('--pretty applies only to --format json or sarif', 'scan');
  const needsMap = format === 'graphml' || table !== 'functions';
  if (needsMap && values['no-calls']) throw new UsageError(`${format === 'graphml' ? '--format graphml' : `--table ${table}`} needs the module map, which --no-calls turns off`, 'scan');
  if (values.level !== undefined && !needsMap) throw new UsageError('--level applies only to --format graphml and --table modules|clusters', 'scan');
  const mapSettings: Partial<MapSettings> = {};
  if (values['folder-depth'] !== undefined) mapSettings.folderDepth = parseCount(values['folder-depth'], '--folder-depth', 1);
  if (values.resolution !== undefined) {
    const r = /^\d+(\.\d+)?$/.test(values.resolution) ? Number(values.resolution) : NaN;
    if (!(r > 0)) throw new UsageError(`--resolution must be a number above 0, got '${values.resolution}'`, 'scan');
    mapSettings.resolution = r;
  }
  return {
    kind: 'scan',
    dir,
    tsconfig: values.tsconfig,
    format,
    table,
    level,
    mapSettings,
    out: values.out,
    pretty: values.pretty ?? false,
    embedSource: values['embed-source'] ?? false,
    settings: {
      switch: oneOf(values.switch ?? DEFAULT_SETTINGS.switch, ['cases', 'one'] as const, '--switch', 'scan'),
      optionalChaining: values['optional-chaining'] ?? DEFAULT_SETTINGS.optionalChaining,
      defaultValues: values['default-values'] ?? DEFAULT_SETTINGS.defaultValues,
      limit: values.limit === undefined ? DEFAULT_SETTINGS.limit : parseLimit(values.limit, 'scan'),
    },
    coverage: values.coverage,
    calls: !values['no-calls'],
    maxLineLength: values['max-line-length'] === undefined ? undefined : parseCount(values['max-line-length'], '--max-line-length', 0),
    threads: values.threads === undefined ? undefined : parseCount(values.threads, '--threads', 1),
  };
}

function parseCheck(args: string[]): CheckCommand {
  const { values, positionals } = parse(args, CHECK_OPTIONS, 'check');
  return {
    kind: 'check',
    snapshot: onePositional(positionals, 'snapshot file to check', 'check'),
    limit: values.limit === undefined ? undefined : parseLimit(values.limit, 'check'),
    baseline: values.baseline,
  };
}

function parsePush(args: string[], env: NodeJS.ProcessEnv): PushCommand {
  const { values, positionals } = parse(args, PUSH_OPTIONS, 'push');
  return pushCommandFrom(values, positionals, env);
}

function isCommand(word: string | undefined): word is CommandName {
  return word !== undefined && COMMANDS.includes(word);
}

/** The command `argv` asks for; throws UsageError for anything else. `env` may hold push's token. */
export function parseCommandLine(argv: readonly string[], env: NodeJS.ProcessEnv = process.env): CliCommand {
  const [first, ...rest] = argv;
  if (isCommand(first)) {
    if (wantsHelp(rest)) return { kind: 'help', topic: first };
    return first === 'scan' ? parseScan(rest) : first === 'check' ? parseCheck(rest) : parsePush(rest, env);
  }
  if (first === undefined) throw new UsageError('no command given (scan, check or push)');
  if (first === '--help' || first === '-h') return { kind: 'help' };
  if (first === 'help') {
    const topic = rest[0];
    if (topic === undefined) return { kind: 'help' };
    if (isCommand(topic)) return { kind: 'help', topic };
    throw new UsageError(`no help for '${topic}': the commands are scan, check and push`);
  }
  if (first === '--version') return { kind: 'version' };
  if (first.startsWith('-')) throw new UsageError(`unknown option ${first} (options go after the command)`);
  throw new UsageError(`unknown command '${first}': the commands are scan, check and push`);
}
