// `seamline push` against a stand-in server on 127.0.0.1, with a snapshot made by a real scan.
import { promises as fsp, readFileSync } from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { tempTree } from '../testing/tempTree';
import { MemoryStream } from './fixtures/memoryStream';
import { startPushTestServer } from './fixtures/pushTestServer';
import type { PushTestServer, RecordedRequest, TestReply } from './fixtures/pushTestServer';
import { runCli } from './main';
import { parseCommandLine } from './parseCommandLine';
import type { PushCommand } from './pushCommandLine';
import { runPush } from './pushSnapshot';
import type { PushTiming } from './pushWait';

const TOKEN = 'slt_test_7c1d2e3f4a5b';
const ID = '6f1c2b7a-3d4e-4f50-8a9b-0c1d2e3f4a5b';
const ACCEPTED = { status: 202, json: { snapshot: { id: ID, status: 'queued', codebaseId: 'cb-1' }, links: { status: `/api/snapshots/${ID}` } } };

let dir: string;
let snapshotBytes: Buffer;
let server: PushTestServer | undefined;

beforeAll(async () => {
  dir = tempTree({
    'code/src/route.ts': 'export function route(n: number) {\n  if (n > 1) return "far";\n  return n < 0 ? "back" : "near";\n}\n',
    'code/src/plain.ts': 'export const plain = () => 1;\n',
  }, 'seamline-push-');
  const scan = await run(['scan', 'code', '--out', 'snap.json']);
  expect(scan.code).toBe(0);
  snapshotBytes = readFileSync(path.join(dir, 'snap.json'));
}, 60000);
afterAll(async () => {
  await fsp.rm(dir, { recursive: true, force: true });
});
afterEach(async () => {
  await server?.close();
  server = undefined;
});

async function run(argv: string[], env: NodeJS.ProcessEnv = {}) {
  const stdout = new MemoryStream();
  const stderr = new MemoryStream();
  const code = await runCli(argv, { stdout, stderr, cwd: dir, env });
  return { code, stdout: stdout.text, stderr: stderr.text };
}

async function serve(reply: (request: RecordedRequest, index: number) => TestReply): Promise<PushTestServer> {
  server = await startPushTestServer(reply);
  return server;
}

const push = (url: string, ...extra: string[]) => ['push', 'snap.json', '--server', url, '--token', TOKEN, '--codebase', 'Otterbay web', ...extra];

describe('seamline push', () => {
  it('should stream the snapshot to POST /api/push with the token, codebase, commit and branch, and print where it is', async () => {
    const { url, requests } = await serve(() => ACCEPTED);
    const result = await run(push(`${url}/`, '--commit', 'a1b2c3d4', '--branch', 'feature/größe & co'));
    expect(result).toEqual({
      code: 0,
      stdout: `Pushed snapshot ${ID} to codebase "Otterbay web" (queued): ${url}/api/snapshots/${ID}\n`,
      stderr: '',
    });
    expect(requests).toHaveLength(1);
    const [request] = requests;
    expect(request.method).toBe('POST');
    expect(request.path).toBe('/api/push');
    expect(request.query).toEqual({ codebase: 'Otterbay web', commit: 'a1b2c3d4', branch: 'feature/größe & co' });
    expect(request.headers).toMatchObject({
      authorization: `Bearer ${TOKEN}`,
      'content-type': 'application/json',
      accept: 'application/json',
      'content-length': String(snapshotBytes.length),
    });
    expect(request.body.equals(snapshotBytes)).toBe(true);
  });

  it('should send only the codebase when no commit or branch is given', async () => {
    const { url, requests } = await serve(() => ACCEPTED);
    expect((await run(push(url))).code).toBe(0);
    expect(requests[0].query).toEqual({ codebase: 'Otterbay web' });
  });

  it('should take the token from SEAMLINE_TOKEN, and --token over it', async () => {
    const { url, requests } = await serve(() => ACCEPTED);
    const argv = ['push', 'snap.json', '--server', url, '--codebase', 'web'];
    expect((await run(argv, { SEAMLINE_TOKEN: 'from-env' })).code).toBe(0);
    expect((await run([...argv, '--token', 'from-flag'], { SEAMLINE_TOKEN: 'from-env' })).code).toBe(0);
    expect(requests.map((r) => r.headers.authorization)).toEqual(['Bearer from-env', 'Bearer from-flag']);
  });

  it.each<[number, string, string]>([
    [401, 'unauthorized', 'The API token is not valid or was revoked; create a new one in the workspace settings.'],
    [413, 'too_large', 'The snapshot is larger than the server accepts (100 MB).'],
    [500, 'internal', 'Something went wrong on our side; the details are in the server log.'],
  ])("should print the server's message for HTTP %i and exit 2", async (status, errorCode, message) => {
    const { url } = await serve(() => ({ status, json: { error: { code: errorCode, message } } }));
    expect(await run(push(url))).toEqual({ code: 2, stdout: '', stderr: `seamline push: ${message} (HTTP ${status})\n` });
  });

  it('should say when an error answer is not a Seamline error', async () => {
    const { url } = await serve(() => ({ status: 502, text: '<html><body>Bad gateway</body></html>' }));
    expect(await run(push(url))).toEqual({
      code: 2,
      stdout: '',
      stderr: `seamline push: the server at ${url} answered HTTP 502 Bad Gateway without a Seamline error message; is --server the address of a Seamline server?\n`,
    });
  });

  it('should say when the accepting answer is not the expected JSON', async () => {
    const { url } = await serve(() => ({ status: 202, text: '{"snapshot": {"id": ' }));
    expect(await run(push(url))).toEqual({
      code: 2,
      stdout: '',
      stderr: `seamline push: the server at ${url} answered HTTP 202 Accepted but not with the accepted snapshot (the upload may have been stored); is --server the address of a Seamline server?\n`,
    });
  });

  it('should name the server when nothing listens there, and exit 2', async () => {
    const probe = http.createServer();
    await new Promise<void>((resolve) => probe.listen(0, '127.0.0.1', resolve));
    const url = `http://127.0.0.1:${(probe.address() as AddressInfo).port}`;
    await new Promise<void>((resolve) => probe.close(() => resolve()));
    expect(await run(push(url))).toEqual({
      code: 2,
      stdout: '',
      stderr: `seamline push: cannot reach the Seamline server at ${url}: the connection was refused (is the address right and the server running?)\n`,
    });
  });

  it('should refuse a file that is not a valid snapshot before contacting the server', async () => {
    const { url, requests } = await serve(() => ACCEPTED);
    await fsp.writeFile(path.join(dir, 'broken.json'), '{"schema": "seamline/snapshot@1", "functions": [');
    await fsp.writeFile(path.join(dir, 'other.json'), JSON.stringify({ ...JSON.parse(snapshotBytes.toString()), functions: 'none' }));
    const withFile = (file: string) => ['push', file, '--server', url, '--token', TOKEN, '--codebase', 'web'];

    const broken = await run(withFile('broken.json'));
    expect(broken.code).toBe(2);
    expect(broken.stderr).toMatch(/^seamline push: broken\.json is not valid JSON\b.*\nNothing was sent to the server\.\n$/);

    const other = await run(withFile('other.json'));
    expect(other.code).toBe(2);
    expect(other.stderr).toBe('seamline push: other.json does not match the snapshot schema (1 problem):\n  /functions: must be array\nNothing was sent to the server.\n');

    expect(await run(withFile('missing.json'))).toEqual({ code: 2, stdout: '', stderr: 'seamline push: cannot read snapshot missing.json: no such file\n' });
    expect(requests).toEqual([]);
  });

  it('should never print the token', async () => {
    const outputs: string[] = [];
    for (const reply of [ACCEPTED, { status: 401, json: { error: { code: 'unauthorized', message: 'bad token' } } }, { status: 500, text: 'oops' }]) {
      const { url } = await serve(() => reply);
      const result = await run(push(url, '--commit', 'abc'));
      outputs.push(result.stdout, result.stderr);
      await server?.close();
      server = undefined;
    }
    expect(outputs.join('')).not.toContain(TOKEN);
  });

  it('should print push help', async () => {
    const result = await run(['push', '--help']);
    expect(result.code).toBe(0);
    expect(result.stdout).toMatch(/^Usage: seamline push <snapshot\.json> --server <url> --codebase <name>/);
    expect((await run(['--help'])).stdout).toContain('push <snapshot.json>');
  });
});

describe('seamline push --wait', () => {
  const statusOf = (status: string, extra: object = {}): TestReply => ({ status: 200, json: { snapshot: { id: ID, status, progress: 0, phase: null, error: null, ...extra } } });

  it('should poll the snapshot with the token until it is ready, and exit 0', async () => {
    const { url, requests } = await serve((request) => (request.method === 'POST' ? ACCEPTED : statusOf('ready', { progress: 100 })));
    expect(await run(push(url, '--wait'))).toEqual({
      code: 0,
      stdout: `Pushed snapshot ${ID} to codebase "Otterbay web" (queued): ${url}/api/snapshots/${ID}\nSnapshot ${ID} is ready: ${url}/api/snapshots/${ID}\n`,
      stderr: '',
    });
    expect(requests.map((r) => `${r.method} ${r.path} ${r.headers.authorization}`)).toEqual([
      `POST /api/push Bearer ${TOKEN}`,
      `GET /api/snapshots/${ID} Bearer ${TOKEN}`,
    ]);
  });

  it("should print the server's reason and exit 1 when the analysis failed", async () => {
    const { url } = await serve((request) => (request.method === 'POST' ? ACCEPTED : statusOf('failed', { error: 'The snapshot names no functions.' })));
    const result = await run(push(url, '--wait'));
    expect(result.code).toBe(1);
    expect(result.stderr).toBe(`seamline push: the server could not analyse snapshot ${ID}: The snapshot names no functions.\n`);
  });

  describe('on a test clock', () => {
    let clock: number;
    const timing: PushTiming = {
      idleTimeoutMs: 5000,
      pollIntervalMs: 1000,
      now: () => clock,
      sleep: async (ms) => {
        clock += ms;
      },
    };
    beforeEach(() => {
      clock = 0;
    });

    async function runWithClock(url: string, ...extra: string[]) {
      const stdout = new MemoryStream();
      const stderr = new MemoryStream();
      const command = parseCommandLine(push(url, '--wait', ...extra), {}) as PushCommand;
      const outcome = await runPush(command, { stdout, stderr, cwd: dir }, timing).then(
        (code) => ({ code, error: undefined }),
        (error: Error) => ({ code: undefined, error: error.message }),
      );
      return { ...outcome, stdout: stdout.text, stderr: stderr.text };
    }

    it('should write a line whenever the status or phase changes, once a second', async () => {
      const states = [statusOf('queued'), statusOf('running', { progress: 10, phase: 'functions' }), statusOf('running', { progress: 20, phase: 'functions' }), statusOf('running', { progress: 70, phase: 'modules' }), statusOf('ready')];
      const times: number[] = [];
      const { url } = await serve((request, index) => {
        if (request.method === 'POST') return ACCEPTED;
        times.push(clock);
        return states[index - 1];
      });
      const result = await runWithClock(url);
      expect(result.code).toBe(0);
      expect(result.stderr).toBe(
        [`snapshot ${ID}: queued`, `snapshot ${ID}: running — functions (10%)`, `snapshot ${ID}: running — modules (70%)`, ''].join('\n'),
      );
      expect(times).toEqual([1000, 2000, 3000, 4000, 5000]);
    });

    it('should stop at --timeout with where the snapshot stands, exit 2', async () => {
      const { url, requests } = await serve((request) => (request.method === 'POST' ? ACCEPTED : statusOf('running', { progress: 50 })));
      const result = await runWithClock(url, '--timeout', '3');
      expect(result.error).toBe(`analyzer/cli: snapshot ${ID} is still running after 3 s (--timeout); the server goes on with it: ${url}/api/snapshots/${ID}`);
      expect(requests.filter((r) => r.method === 'GET')).toHaveLength(3);
      expect(clock).toBe(3000);
    });

    it('should ride out two failed status requests in a row, but not three', async () => {
      const flaky = [statusOf('running'), { status: 503, text: 'busy' }, 'drop', statusOf('ready')] as TestReply[];
      const first = await serve((request, index) => (request.method === 'POST' ? ACCEPTED : flaky[index - 1]));
      expect((await runWithClock(first.url)).code).toBe(0);
      await first.close();

      const down = await serve((request) => (request.method === 'POST' ? ACCEPTED : { status: 503, text: 'busy' }));
      const result = await runWithClock(down.url);
      expect(result.error).toBe(`analyzer/cli: the server at ${down.url} answered HTTP 503 Service Unavailable without a Seamline error message; is --server the address of a Seamline server?`);
      expect(down.requests.filter((r) => r.method === 'GET')).toHaveLength(3);
    });

    it("should stop at once on the server's refusal of the status request", async () => {
      const { url, requests } = await serve((request) =>
        request.method === 'POST' ? ACCEPTED : { status: 403, json: { error: { code: 'forbidden', message: 'This token may push but not read snapshots.' } } },
      );
      const result = await runWithClock(url);
      expect(result.error).toBe('analyzer/cli: This token may push but not read snapshots. (HTTP 403)');
      expect(requests).toHaveLength(2);
    });
  });
});
