import express from 'express';
import { once } from 'node:events';
import { mkdtemp, readdir, readFile, rm } from 'node:fs/promises';
import { createServer, request as httpRequest, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { basename, join } from 'node:path';
import request from 'supertest';
import { errorHandler } from '../http/error-handler';
import { createLogger } from '../logger';
import { receiveZipUpload, type ReceivedUpload } from './receive-upload';
import { refusalOf } from './testing/refusal-of';
import { zipWithYazl } from './testing/yazl-zip';
import { DEFAULT_UPLOAD_LIMITS, type UploadLimits } from './upload-limits';

const LIMIT = 64 * 1024;

describe('receiveZipUpload', () => {
  let server: Server;
  let base: string;
  let dir: string;
  let limits: UploadLimits;
  /** What each request's receiveZipUpload settled to, in arrival order. */
  let outcomes: Promise<ReceivedUpload>[];

  beforeAll(async () => {
    const app = express();
    app.post('/upload', async (req, res) => {
      const outcome = receiveZipUpload(req, { dir, limits });
      outcomes.push(outcome);
      res.status(201).json(await outcome);
    });
    app.post('/upload-codebase', async (req, res) => {
      res.status(201).json(await receiveZipUpload(req, { dir, limits, fileField: 'codebase' }));
    });
    app.use(errorHandler(createLogger('upload-test', 'silent')));
    server = createServer(app);
    server.listen(0, '127.0.0.1');
    await once(server, 'listening');
    base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  });
  afterAll(async () => {
    server.closeAllConnections();
    server.close();
    await once(server, 'close');
  });

  beforeEach(async () => {
    dir = await mkdtemp(join(tmpdir(), 'seamline-receive-'));
    limits = { ...DEFAULT_UPLOAD_LIMITS, maxUploadBytes: LIMIT };
    outcomes = [];
  });
  afterEach(() => rm(dir, { recursive: true, force: true }));

  const upload = () => request(base).post('/upload');

  /** The one request's refusal, once its partial file is gone. */
  async function refusalAndEmptyDir(code: string) {
    expect(outcomes).toHaveLength(1);
    const err = await refusalOf(outcomes[0]!);
    expect(err.code).toBe(code);
    expect(await readdir(dir)).toEqual([]);
    return err;
  }

  it('should store the file under a new name and return it with the text fields', async () => {
    const zip = await zipWithYazl({ 'app/src/main.ts': 'main();\n' });
    const res = await upload().field('name', 'Dispatch').field('note', 'first try').attach('file', zip, 'dispatch.zip').expect(201);
    expect(res.body).toEqual({ file: expect.any(String), bytes: zip.length, originalName: 'dispatch.zip', fields: { name: 'Dispatch', note: 'first try' } });
    expect(res.body.file.startsWith(dir)).toBe(true);
    expect(basename(res.body.file)).not.toContain('dispatch');
    expect(await readdir(dir)).toEqual([basename(res.body.file)]);
    expect((await readFile(res.body.file)).equals(zip)).toBe(true);
  });

  it('should read the file from another field when told to', async () => {
    const res = await request(base).post('/upload-codebase').attach('codebase', Buffer.from('PK\u0003\u0004'), 'c.zip').expect(201);
    expect(res.body.bytes).toBe(4);
    const refused = await request(base).post('/upload-codebase').attach('file', Buffer.from('PK'), 'c.zip').expect(400);
    expect(refused.body.error.message).toBe('The upload has a file in the "file" field; send the zip in the "codebase" field.');
  });

  it('should accept a file of exactly the limit', async () => {
    const res = await upload().attach('file', Buffer.alloc(LIMIT, 1), 'big.zip').expect(201);
    expect(res.body.bytes).toBe(LIMIT);
  });

  it('should refuse a file over the limit with 413 and keep nothing', async () => {
    const res = await upload()
      .attach('file', Buffer.alloc(LIMIT + LIMIT / 2, 1), 'huge.zip')
      .expect(413);
    expect(res.body.error).toEqual({
      code: 'upload_too_large',
      message: expect.stringMatching(/^The upload is larger than 64 KB, the limit, so nothing was kept\./),
      details: { limit: LIMIT },
    });
    await refusalAndEmptyDir('upload_too_large');
  });

  it('should stop and keep nothing when a client sends far more than the limit', async () => {
    const body = multipart([{ name: 'file', filename: 'huge.zip', data: Buffer.alloc(LIMIT * 8, 1) }]);
    await rawPost(body).catch(() => undefined);
    await refusalAndEmptyDir('upload_too_large');
  });

  it('should refuse a request that is not multipart', async () => {
    const res = await upload().send({ file: 'not a file' }).expect(400);
    expect(res.body.error.code).toBe('not_multipart');
    expect(res.body.error.message).toBe(
      'Send the zip as multipart/form-data with the file in the "file" field; this request came as "application/json".',
    );
    await refusalAndEmptyDir('not_multipart');
  });

  it('should refuse a multipart request without a boundary', async () => {
    const res = await upload().set('Content-Type', 'multipart/form-data').send('whatever').expect(400);
    expect(res.body.error.code).toBe('bad_multipart');
    expect(res.body.error.message).toMatch(/could not be read as multipart\/form-data \(.*[Bb]oundary/);
  });

  it('should refuse a form cut short and delete what it had written', async () => {
    const whole = multipart([{ name: 'file', filename: 'a.zip', data: Buffer.alloc(4096, 1) }]);
    await rawPost(whole.subarray(0, whole.length - 40));
    const err = await refusalAndEmptyDir('bad_multipart');
    expect(err.status).toBe(400);
  });

  it('should refuse a form with no file', async () => {
    const res = await upload().field('name', 'Dispatch').expect(400);
    expect(res.body.error).toEqual({ code: 'no_file', message: 'The upload has no file in the "file" field; attach the zip there.' });
  });

  it('should refuse an empty file and keep nothing', async () => {
    const res = await upload().attach('file', Buffer.alloc(0), 'empty.zip').expect(400);
    expect(res.body.error.code).toBe('empty_upload');
    expect(res.body.error.message).toMatch(/file is empty/);
    await refusalAndEmptyDir('empty_upload');
  });

  it('should refuse a second file and keep neither', async () => {
    const res = await upload().attach('file', Buffer.from('one'), 'one.zip').attach('file', Buffer.from('two'), 'two.zip').expect(400);
    expect(res.body.error.code).toBe('too_many_files');
    expect(res.body.error.message).toMatch(/more than one file/);
    await refusalAndEmptyDir('too_many_files');
  });

  it('should refuse a file in another field, naming both fields', async () => {
    const res = await upload().attach('zip', Buffer.from('PK'), 'a.zip').expect(400);
    expect(res.body.error).toEqual({
      code: 'unexpected_file',
      message: 'The upload has a file in the "zip" field; send the zip in the "file" field.',
    });
  });

  it('should refuse a text field over its limit, even after the file, and keep nothing', async () => {
    const res = await upload().attach('file', Buffer.alloc(1000, 1), 'a.zip').field('name', 'x'.repeat(8 * 1024 + 1)).expect(400);
    expect(res.body.error).toEqual({ code: 'bad_field', message: 'The "name" field is longer than 8 KB, the limit for a text field.' });
    await refusalAndEmptyDir('bad_field');
  });

  it('should accept a text field of exactly its limit', async () => {
    const res = await upload().field('name', 'x'.repeat(8 * 1024)).attach('file', Buffer.from('PK'), 'a.zip').expect(201);
    expect(res.body.fields.name).toHaveLength(8 * 1024);
  });

  it('should refuse a text field sent twice', async () => {
    const res = await upload().field('name', 'a').field('name', 'b').attach('file', Buffer.from('PK'), 'a.zip').expect(400);
    expect(res.body.error.message).toBe('The "name" field is sent more than once; send it once.');
  });

  it('should refuse too many text fields', async () => {
    let req = upload();
    for (let i = 0; i <= 20; i++) req = req.field(`f${i}`, 'v');
    const res = await req.attach('file', Buffer.from('PK'), 'a.zip').expect(400);
    expect(res.body.error.message).toBe('The upload has more than 20 text fields, the limit.');
  });

  it('should keep a field named __proto__ as a plain field', async () => {
    await upload().field('__proto__', 'x').attach('file', Buffer.from('PK'), 'a.zip').expect(201);
    const { fields } = await outcomes[0]!;
    expect(Object.getPrototypeOf(fields)).toBe(Object.prototype);
    expect(Object.hasOwn(fields, '__proto__')).toBe(true);
  });

  it('should keep nothing and not hang when the client goes away mid-upload', async () => {
    const body = multipart([{ name: 'file', filename: 'a.zip', data: Buffer.alloc(LIMIT - 1000, 1) }]);
    const client = httpRequest(`${base}/upload`, {
      method: 'POST',
      headers: { 'Content-Type': `multipart/form-data; boundary=${BOUNDARY}`, 'Content-Length': body.length },
    });
    client.on('error', () => undefined);
    client.write(body.subarray(0, body.length / 2));
    while ((await readdir(dir)).length === 0) await new Promise((r) => setTimeout(r, 10));
    client.destroy();
    const err = await refusalAndEmptyDir('upload_aborted');
    expect(err.message).toBe('The upload stopped before it was complete, so nothing was kept. Try again.');
  });

  const BOUNDARY = 'seamline-test-boundary';

  function multipart(parts: { name: string; filename: string; data: Buffer }[]): Buffer {
    const chunks = parts.flatMap((p) => [
      Buffer.from(`--${BOUNDARY}\r\nContent-Disposition: form-data; name="${p.name}"; filename="${p.filename}"\r\nContent-Type: application/zip\r\n\r\n`),
      p.data,
      Buffer.from('\r\n'),
    ]);
    return Buffer.concat([...chunks, Buffer.from(`--${BOUNDARY}--\r\n`)]);
  }

  /** Posts `body` whole and resolves with the status, or rejects if the server cuts the connection. */
  function rawPost(body: Buffer): Promise<number> {
    return new Promise((resolve, reject) => {
      const client = httpRequest(`${base}/upload`, {
        method: 'POST',
        headers: { 'Content-Type': `multipart/form-data; boundary=${BOUNDARY}`, 'Content-Length': body.length },
      });
      client.on('error', reject);
      client.on('response', (res) => {
        res.resume();
        res.on('end', () => resolve(res.statusCode ?? 0));
      });
      client.end(body);
    });
  }
});
