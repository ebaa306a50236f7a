import { DEFAULT_SETTINGS } from '../model';
import { parseCommandLine } from './parseCommandLine';
import { UsageError } from './UsageError';
import type { CommandName } from './UsageError';

function usageError(argv: string[]): UsageError {
  try {
    parseCommandLine(argv);
  } catch (error) {
    expect(error).toBeInstanceOf(UsageError);
    return error as UsageError;
  }
  throw new Error(`expected a usage error for ${argv.join(' ')}`);
}

describe('parseCommandLine', () => {
  it('should give scan the published defaults', () => {
    expect(parseCommandLine(['scan', 'src'])).toEqual({
      kind: 'scan',
      dir: 'src',
      tsconfig: undefined,
      format: 'json',
      table: 'functions',
      level: 'folder',
      mapSettings: {},
      out: undefined,
      pretty: false,
      embedSource: false,
      settings: { ...DEFAULT_SETTINGS },
      coverage: undefined,
      calls: true,
      maxLineLength: undefined,
      threads: undefined,
    });
  });

  it('should read every scan option', () => {
    const command = parseCommandLine([
      'scan', 'app', '--tsconfig', 'tsconfig.app.json', '--format', 'csv', '--table', 'functions', '-o', 'out.csv',
      '--limit', '15', '--switch', 'one', '--optional-chaining', '--default-values', '--coverage', 'lcov.info',
      '--no-calls', '--embed-source',
    ]);
    expect(command).toMatchObject({
      kind: 'scan', dir: 'app', tsconfig: 'tsconfig.app.json', format: 'csv', out: 'out.csv', coverage: 'lcov.info',
      calls: false, embedSource: true,
      settings: { switch: 'one', optionalChaining: true, defaultValues: true, limit: 15 },
    });
    expect(parseCommandLine(['scan', '--format=sarif', '--pretty', 'x'])).toMatchObject({ format: 'sarif', pretty: true, dir: 'x' });
  });

  it('should read check with and without its options', () => {
    expect(parseCommandLine(['check', 'snap.json'])).toEqual({ kind: 'check', snapshot: 'snap.json', limit: undefined, baseline: undefined });
    expect(parseCommandLine(['check', 'snap.json', '--limit', '12', '--baseline', 'old.json'])).toEqual({
      kind: 'check', snapshot: 'snap.json', limit: 12, baseline: 'old.json',
    });
  });

  it('should find help and version', () => {
    expect(parseCommandLine(['--help'])).toEqual({ kind: 'help' });
    expect(parseCommandLine(['-h'])).toEqual({ kind: 'help' });
    expect(parseCommandLine(['help', 'check'])).toEqual({ kind: 'help', topic: 'check' });
    expect(parseCommandLine(['scan', '--help'])).toEqual({ kind: 'help', topic: 'scan' });
    expect(parseCommandLine(['scan', '--bogus', '-h'])).toEqual({ kind: 'help', topic: 'scan' });
    expect(parseCommandLine(['--version'])).toEqual({ kind: 'version' });
  });

  it('should treat --help after -- as a folder name', () => {
    expect(parseCommandLine(['scan', '--', '--help'])).toMatchObject({ kind: 'scan', dir: '--help' });
  });

  it.each<[string[], string, CommandName | undefined]>([
    [[], 'no command given (scan, check or push)', undefined],
    [['scna', 'src'], "unknown command 'scna': the commands are scan, check and push", undefined],
    [['--limit', '3'], 'unknown option --limit (options go after the command)', undefined],
    [['help', 'lint'], "no help for 'lint': the commands are scan, check and push", undefined],
    [['scan'], 'missing folder to scan', 'scan'],
    [['scan', 'a', 'b'], 'expects one folder to scan, got 2: a b', 'scan'],
    [['scan', 'src', '--bogus'], 'unknown option --bogus', 'scan'],
    [['scan', 'src', '-x'], 'unknown option -x', 'scan'],
    [['scan', 'src', '--out'], 'option --out needs a value', 'scan'],
    [['scan', 'src', '--tsconfig', '--pretty'], 'option --tsconfig needs a value', 'scan'],
    [['scan', 'src', '--pretty=yes'], 'option --pretty does not take a value', 'scan'],
    [['scan', 'src', '--format', 'xml'], "--format must be json or sarif or csv or graphml, got 'xml'", 'scan'],
    [['scan', 'src', '--format', 'graphml', '--no-calls'], '--format graphml needs the module map, which --no-calls turns off', 'scan'],
    [['scan', 'src', '--format', 'csv', '--table', 'modules', '--no-calls'], '--table modules needs the module map, which --no-calls turns off', 'scan'],
    [['scan', 'src', '--format', 'csv', '--table', 'files'], "--table must be functions or modules or clusters, got 'files'", 'scan'],
    [['scan', 'src', '--level', 'folder'], '--level applies only to --format graphml and --table modules|clusters', 'scan'],
    [['scan', 'src', '--format', 'graphml', '--level', 'module'], "--level must be file or folder or package, got 'module'", 'scan'],
    [['scan', 'src', '--resolution', '0'], "--resolution must be a number above 0, got '0'", 'scan'],
    [['scan', 'src', '--folder-depth', '0'], "--folder-depth must be a whole number of at least 1, got '0'", 'scan'],
    [['scan', 'src', '--table', 'functions'], '--table applies only to --format csv', 'scan'],
    [['scan', 'src', '--format', 'csv', '--pretty'], '--pretty applies only to --format json or sarif', 'scan'],
    [['scan', 'src', '--switch', 'each'], "--switch must be cases or one, got 'each'", 'scan'],
    [['scan', 'src', '--limit', 'ten'], "--limit must be a whole number of at least 1, got 'ten'", 'scan'],
    [['scan', 'src', '--limit', '0'], "--limit must be a whole number of at least 1, got '0'", 'scan'],
    [['scan', 'src', '--limit', '10.5'], "--limit must be a whole number of at least 1, got '10.5'", 'scan'],
    [['scan', 'src', '--limit=-3'], "--limit must be a whole number of at least 1, got '-3'", 'scan'],
    [['check'], 'missing snapshot file to check', 'check'],
    [['check', 'a.json', '--limit', ''], "--limit must be a whole number of at least 1, got ''", 'check'],
    [['check', 'a.json', '--baseline'], 'option --baseline needs a value', 'check'],
    [['check', 'a.json', '--format', 'json'], 'unknown option --format', 'check'],
  ])('should refuse %j with one clear line', (argv, reason, command) => {
    const error = usageError(argv);
    expect(error.reason).toBe(reason);
    expect(error.command).toBe(command);
    expect(error.hint).toBe(`Run \`seamline ${command ? `${command} ` : ''}--help\` for usage.`);
  });
});
