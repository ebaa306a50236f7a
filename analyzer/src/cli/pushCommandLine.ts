/**
 * `seamline push` options
 * =======================
 * The option table (parsed by parseCommandLine's strict parser) and the checks that turn its
 * values into a `PushCommand`: an http(s) server address, a token from `--token` or
 * `SEAMLINE_TOKEN`, a codebase name and an optional commit and branch. Every refusal is a
 * `UsageError` that never repeats the token, since CI logs are often public.
 */
import { UsageError } from './UsageError';

/** What `seamline push` was asked to do. */
export interface PushCommand {
  kind: 'push';
  snapshot: string;
  /** The server's base address without a trailing slash (`https://seamline.example.com`). */
  server: string;
  token: string;
  codebase: string;
  commit?: string;
  branch?: string;
  /** Wait until the server has analysed the snapshot. */
  wait: boolean;
  /** How long `--wait` waits, in seconds. */
  timeoutSeconds: number;
}

export const PUSH_OPTIONS = {
  server: { type: 'string' },
  token: { type: 'string' },
  codebase: { type: 'string' },
  commit: { type: 'string' },
  branch: { type: 'string' },
  wait: { type: 'boolean' },
  timeout: { type: 'string' },
  help: { type: 'boolean', short: 'h' },
} as const;

/** The environment variable that may carry the token (`--token` wins). */
export const TOKEN_VARIABLE = 'SEAMLINE_TOKEN';
export const DEFAULT_WAIT_SECONDS = 600;
// The server's column sizes (codebase.name 200, snapshot.commit_sha 64, snapshot.branch 255).
const MAX_CODEBASE = 200;
const MAX_BRANCH = 255;
const COMMIT = /^[0-9A-Za-z._-]{1,64}$/;
// Control characters cannot go into a URL query safely and are never part of a real name.
// eslint-disable-next-line no-control-regex
const CONTROL = /[\u0000-\u001f\u007f]/;
// A header value: visible ASCII only, so the token is sent exactly as written.
const HEADER_SAFE = /^[\x21-\x7e]+$/;

function refuse(reason: string): never {
  throw new UsageError(reason, 'push');
}

/** The server's base address from `--server`: http(s), no credentials, query or fragment. */
export function serverBase(text: string): string {
  let url: URL;
  try {
    url = new URL(text);
  } catch {
    refuse(`--server must be an http:// or https:// address, got '${text}'`);
  }
  if (url.protocol !== 'http:' && url.protocol !== 'https:') {
    refuse(`--server must be an http:// or https:// address, got '${text}'`);
  }
  if (url.username !== '' || url.password !== '') {
    refuse(`--server must not contain a user name or password; give the token with --token or ${TOKEN_VARIABLE}`);
  }
  if (url.search !== '' || url.hash !== '') refuse(`--server must be the server's address without a ?query or #fragment, got '${text}'`);
  return `${url.origin}${url.pathname.replace(/\/+$/, '')}`;
}

function tokenFrom(flag: string | undefined, env: NodeJS.ProcessEnv): string {
  const fromEnv = env[TOKEN_VARIABLE];
  const token = flag ?? (fromEnv === '' ? undefined : fromEnv);
  const source = flag === undefined ? TOKEN_VARIABLE : '--token';
  if (token === undefined) refuse(`missing API token: give --token or set ${TOKEN_VARIABLE} (a workspace API token)`);
  if (!HEADER_SAFE.test(token)) {
    refuse(`the token from ${source} is empty or contains spaces or other characters a token never has; copy it again from the workspace's API tokens`);
  }
  return token;
}

function codebaseFrom(name: string | undefined): string {
  if (name === undefined) refuse('missing --codebase: the name of the codebase on the server');
  if (name.trim() === '') refuse('--codebase must not be empty');
  if (name.length > MAX_CODEBASE) refuse(`--codebase must be at most ${MAX_CODEBASE} characters, got ${name.length}`);
  if (CONTROL.test(name)) refuse('--codebase must not contain control characters');
  return name;
}

function commitFrom(commit: string | undefined): string | undefined {
  if (commit === undefined || COMMIT.test(commit)) return commit;
  refuse(`--commit must be 1 to 64 letters, digits, '.', '_' or '-' (a commit id), got '${commit}'`);
}

function branchFrom(branch: string | undefined): string | undefined {
  if (branch === undefined) return undefined;
  if (branch === '') refuse('--branch must not be empty');
  if (branch.length > MAX_BRANCH) refuse(`--branch must be at most ${MAX_BRANCH} characters, got ${branch.length}`);
  if (CONTROL.test(branch)) refuse('--branch must not contain control characters');
  return branch;
}

function timeoutFrom(value: string | undefined, wait: boolean): number {
  if (value === undefined) return DEFAULT_WAIT_SECONDS;
  if (!wait) refuse('--timeout applies only with --wait');
  const n = /^\d+$/.test(value) ? Number(value) : NaN;
  if (!Number.isSafeInteger(n) || n < 1) refuse(`--timeout must be a whole number of seconds of at least 1, got '${value}'`);
  return n;
}

/** The parsed values of `PUSH_OPTIONS`. */
export interface PushOptionValues {
  server?: string;
  token?: string;
  codebase?: string;
  commit?: string;
  branch?: string;
  wait?: boolean;
  timeout?: string;
}

/** Check the parsed options and positionals of `seamline push`; throws UsageError. */
export function pushCommandFrom(values: PushOptionValues, positionals: string[], env: NodeJS.ProcessEnv): PushCommand {
  if (positionals.length === 0) refuse('missing snapshot file to push');
  if (positionals.length > 1) refuse(`expects one snapshot file to push, got ${positionals.length}: ${positionals.join(' ')}`);
  if (values.server === undefined) refuse("missing --server: the Seamline server's address, e.g. https://seamline.example.com");
  const wait = values.wait ?? false;
  return {
    kind: 'push',
    snapshot: positionals[0],
    server: serverBase(values.server),
    token: tokenFrom(values.token, env),
    codebase: codebaseFrom(values.codebase),
    commit: commitFrom(values.commit),
    branch: branchFrom(values.branch),
    wait,
    timeoutSeconds: timeoutFrom(values.timeout, wait),
  };
}
