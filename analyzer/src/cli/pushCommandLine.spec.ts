import { parseCommandLine } from './parseCommandLine';
import { serverBase } from './pushCommandLine';
import { UsageError } from './UsageError';

const TOKEN = 'slt_9f8e7d6c5b4a';
const BASE = ['push', 'snap.json', '--server', 'https://seamline.example.com', '--codebase', 'web'];

function refusal(argv: string[], env: NodeJS.ProcessEnv = { SEAMLINE_TOKEN: TOKEN }): UsageError {
  try {
    parseCommandLine(argv, env);
  } catch (error) {
    expect(error).toBeInstanceOf(UsageError);
    return error as UsageError;
  }
  throw new Error(`expected a usage error for ${argv.join(' ')}`);
}

describe('parseCommandLine push', () => {
  it('should take the token from SEAMLINE_TOKEN and give --wait its default timeout', () => {
    expect(parseCommandLine(BASE, { SEAMLINE_TOKEN: TOKEN })).toEqual({
      kind: 'push',
      snapshot: 'snap.json',
      server: 'https://seamline.example.com',
      token: TOKEN,
      codebase: 'web',
      commit: undefined,
      branch: undefined,
      wait: false,
      timeoutSeconds: 600,
    });
  });

  it('should prefer --token over SEAMLINE_TOKEN and read every option', () => {
    const argv = [...BASE, '--token', 'from-flag', '--commit', 'a1B2.c3_d-4', '--branch', 'feature/x', '--wait', '--timeout', '30'];
    expect(parseCommandLine(argv, { SEAMLINE_TOKEN: TOKEN })).toMatchObject({
      token: 'from-flag',
      commit: 'a1B2.c3_d-4',
      branch: 'feature/x',
      wait: true,
      timeoutSeconds: 30,
    });
  });

  it('should give help for push', () => {
    expect(parseCommandLine(['push', '--help'], {})).toEqual({ kind: 'help', topic: 'push' });
    expect(parseCommandLine(['help', 'push'], {})).toEqual({ kind: 'help', topic: 'push' });
  });

  it.each<[string[], string]>([
    [['push', '--server', 'https://s', '--codebase', 'web'], 'missing snapshot file to push'],
    [['push', 'a.json', 'b.json', '--server', 'https://s', '--codebase', 'web'], 'expects one snapshot file to push, got 2: a.json b.json'],
    [['push', 'snap.json', '--codebase', 'web'], "missing --server: the Seamline server's address, e.g. https://seamline.example.com"],
    [['push', 'snap.json', '--server', 'https://s'], 'missing --codebase: the name of the codebase on the server'],
    [[...BASE, '--codebase', '  '], '--codebase must not be empty'],
    [[...BASE, '--codebase', 'x'.repeat(201)], '--codebase must be at most 200 characters, got 201'],
    [[...BASE, '--codebase', 'a\nb'], '--codebase must not contain control characters'],
    [[...BASE, '--commit', 'abc def'], "--commit must be 1 to 64 letters, digits, '.', '_' or '-' (a commit id), got 'abc def'"],
    [[...BASE, '--commit', 'a'.repeat(65)], `--commit must be 1 to 64 letters, digits, '.', '_' or '-' (a commit id), got '${'a'.repeat(65)}'`],
    [[...BASE, '--commit', ''], "--commit must be 1 to 64 letters, digits, '.', '_' or '-' (a commit id), got ''"],
    [[...BASE, '--branch', ''], '--branch must not be empty'],
    [[...BASE, '--branch', 'b'.repeat(256)], '--branch must be at most 255 characters, got 256'],
    [[...BASE, '--branch', 'a\tb'], '--branch must not contain control characters'],
    [[...BASE, '--timeout', '5'], '--timeout applies only with --wait'],
    [[...BASE, '--wait', '--timeout', '0'], "--timeout must be a whole number of seconds of at least 1, got '0'"],
    [[...BASE, '--wait', '--timeout', '1.5'], "--timeout must be a whole number of seconds of at least 1, got '1.5'"],
    [[...BASE, '--wait=yes'], 'option --wait does not take a value'],
    [[...BASE, '--server'], 'option --server needs a value'],
    [[...BASE, '--limit', '3'], 'unknown option --limit'],
  ])('should refuse %j with one clear line', (argv, reason) => {
    const error = refusal(argv);
    expect(error.reason).toBe(reason);
    expect(error.hint).toBe('Run `seamline push --help` for usage.');
  });

  it('should ask for a token when neither --token nor SEAMLINE_TOKEN gives one', () => {
    const expected = 'missing API token: give --token or set SEAMLINE_TOKEN (a workspace API token)';
    expect(refusal(BASE, {}).reason).toBe(expected);
    expect(refusal(BASE, { SEAMLINE_TOKEN: '' }).reason).toBe(expected);
  });

  it('should refuse a token that cannot be a token without repeating it', () => {
    const fromFlag = refusal([...BASE, '--token', 'secret part two'], {});
    expect(fromFlag.reason).toBe("the token from --token is empty or contains spaces or other characters a token never has; copy it again from the workspace's API tokens");
    const fromEnv = refusal(BASE, { SEAMLINE_TOKEN: 'secret\n' });
    expect(fromEnv.reason).toMatch(/^the token from SEAMLINE_TOKEN is empty or contains spaces/);
    expect(`${fromFlag.reason}${fromEnv.reason}`).not.toMatch(/secret/);
    expect(refusal([...BASE, '--token', ''], {}).reason).toMatch(/^the token from --token is empty/);
  });
});

describe('serverBase', () => {
  it.each<[string, string]>([
    ['https://seamline.example.com', 'https://seamline.example.com'],
    ['https://seamline.example.com/', 'https://seamline.example.com'],
    ['HTTP://LOCALHOST:3000//', 'http://localhost:3000'],
    ['https://example.com/tools/seamline/', 'https://example.com/tools/seamline'],
  ])('should take %s as %s', (text, base) => {
    expect(serverBase(text)).toBe(base);
  });

  it.each<[string, string]>([
    ['seamline.example.com', "--server must be an http:// or https:// address, got 'seamline.example.com'"],
    ['localhost:3000', "--server must be an http:// or https:// address, got 'localhost:3000'"],
    ['ftp://seamline.example.com', "--server must be an http:// or https:// address, got 'ftp://seamline.example.com'"],
    ['https://me:pw@seamline.example.com', '--server must not contain a user name or password; give the token with --token or SEAMLINE_TOKEN'],
    ['https://seamline.example.com/?a=1', "--server must be the server's address without a ?query or #fragment, got 'https://seamline.example.com/?a=1'"],
    ['https://seamline.example.com/#x', "--server must be the server's address without a ?query or #fragment, got 'https://seamline.example.com/#x'"],
  ])('should refuse %s', (text, reason) => {
    expect(() => serverBase(text)).toThrow(UsageError);
    expect(() => serverBase(text)).toThrow(reason);
  });
});
