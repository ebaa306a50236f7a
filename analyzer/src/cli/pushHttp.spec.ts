import { promises as fsp } from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { CliInputError } from './CliInputError';
import { startPushTestServer } from './fixtures/pushTestServer';
import type { PushTestServer } from './fixtures/pushTestServer';
import { describeNetworkError, exchange, MAX_ANSWER_BYTES } from './pushHttp';

let dir: string;
let server: PushTestServer | undefined;
beforeEach(async () => {
  dir = await fsp.mkdtemp(path.join(os.tmpdir(), 'seamline-push-http-'));
});
afterEach(async () => {
  await server?.close();
  server = undefined;
  await fsp.rm(dir, { recursive: true, force: true });
});

const get = (url: string, idleTimeoutMs = 5000) =>
  exchange({ method: 'GET', url: new URL(url), headers: { Accept: 'application/json' }, idleTimeoutMs, server: url });

describe('exchange', () => {
  it('should stream a file as the body with its Content-Length and return the answer', async () => {
    const file = path.join(dir, 'body.json');
    const bytes = Buffer.from(`{"x":"${'é'.repeat(200_000)}"}`);
    await fsp.writeFile(file, bytes);
    server = await startPushTestServer(() => ({ status: 201, json: { ok: true }, headers: { Location: '/there' } }));
    const answer = await exchange({
      method: 'POST',
      url: new URL(`${server.url}/up`),
      headers: { 'Content-Type': 'application/json' },
      bodyFile: { path: file, size: bytes.length },
      idleTimeoutMs: 5000,
      server: server.url,
    });
    expect(answer).toEqual({ status: 201, statusText: 'Created', contentType: 'application/json; charset=utf-8', location: '/there', body: '{"ok":true}' });
    expect(server.requests).toHaveLength(1);
    expect(server.requests[0].headers['content-length']).toBe(String(bytes.length));
    expect(server.requests[0].body.equals(bytes)).toBe(true);
  });

  it('should take the answer of a server that refuses before reading the body', async () => {
    const file = path.join(dir, 'big.json');
    const size = 32 * 1024 * 1024;
    await fsp.writeFile(file, Buffer.alloc(size, 0x20));
    server = await startPushTestServer(
      () => ({ status: 413, json: { error: { code: 'too_large', message: 'too big' } }, headers: { Connection: 'close' } }),
      { answerEarly: true },
    );
    const answer = await exchange({
      method: 'POST',
      url: new URL(server.url),
      headers: {},
      bodyFile: { path: file, size },
      idleTimeoutMs: 5000,
      server: server.url,
    });
    expect(answer.status).toBe(413);
    expect(JSON.parse(answer.body)).toEqual({ error: { code: 'too_large', message: 'too big' } });
  });

  it('should give up on a server that never answers after the idle time, naming it', async () => {
    server = await startPushTestServer(() => 'no answer');
    const failure = get(server.url, 150);
    await expect(failure).rejects.toBeInstanceOf(CliInputError);
    await expect(failure).rejects.toThrow(`the Seamline server at ${server.url} did not answer within 0.15 s`);
  });

  it('should say so when the server drops the connection without answering', async () => {
    server = await startPushTestServer(() => 'drop');
    await expect(get(server.url)).rejects.toThrow(`the connection to the Seamline server at ${server.url} was closed before it answered; try again`);
  });

  it('should refuse an answer larger than the cap', async () => {
    server = await startPushTestServer(() => ({ status: 200, text: 'x'.repeat(MAX_ANSWER_BYTES + 1) }));
    await expect(get(server.url)).rejects.toThrow(`the server at ${server.url} sent an answer larger than 1024 KiB (HTTP 200)`);
  });

  it('should say the connection was refused when nothing listens on the port', async () => {
    const probe = http.createServer();
    await new Promise<void>((resolve) => probe.listen(0, '127.0.0.1', resolve));
    const { port } = probe.address() as AddressInfo;
    await new Promise<void>((resolve) => probe.close(() => resolve()));
    await expect(get(`http://127.0.0.1:${port}`)).rejects.toThrow(
      `cannot reach the Seamline server at http://127.0.0.1:${port}: the connection was refused (is the address right and the server running?)`,
    );
  });

  it('should report a body file that cannot be read', async () => {
    server = await startPushTestServer(() => ({ status: 202, json: {} }));
    const missing = path.join(dir, 'gone.json');
    await expect(
      exchange({ method: 'POST', url: new URL(server.url), headers: {}, bodyFile: { path: missing, size: 10 }, idleTimeoutMs: 5000, server: server.url }),
    ).rejects.toThrow(`cannot read ${missing} while uploading it`);
  });
});

describe('describeNetworkError', () => {
  const at = 'the Seamline server at https://seamline.example.com';
  it.each<[string, string]>([
    ['ENOTFOUND', `cannot reach ${at}: its host name could not be resolved (check --server and the network)`],
    ['EAI_AGAIN', `cannot reach ${at}: its host name could not be resolved (check --server and the network)`],
    ['ECONNRESET', `the connection to ${at} was closed before it answered; try again`],
    ['EHOSTUNREACH', `cannot reach ${at}: the network gave up (EHOSTUNREACH); check --server and the network`],
    ['CERT_HAS_EXPIRED', `cannot reach ${at}: its TLS certificate was refused (CERT_HAS_EXPIRED: boom)`],
    ['EWHATEVER', `cannot reach ${at}: EWHATEVER: boom`],
  ])('should describe %s', (code, text) => {
    expect(describeNetworkError(Object.assign(new Error('boom'), { code }), 'https://seamline.example.com', 1000)).toBe(text);
  });
});
