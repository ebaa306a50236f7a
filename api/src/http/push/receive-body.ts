import { randomUUID } from 'node:crypto';
import * as fs from 'node:fs';
import * as path from 'node:path';
import { pipeline } from 'node:stream/promises';
import { Transform } from 'node:stream';
import type { Request } from 'express';
import { UploadRefusedError } from '../../uploads/upload-errors';
import { formatBytes } from '../../uploads/byte-size';

/** Streams a request body to a new file in `dir`, refusing more than `maxBytes`; nothing is left behind on failure. */
export async function receiveBody(req: Request, dir: string, maxBytes: number): Promise<{ file: string; bytes: number }> {
  await fs.promises.mkdir(dir, { recursive: true });
  const declared = Number(req.get('content-length') ?? NaN);
  if (declared > maxBytes) throw tooLarge(maxBytes);
  const file = path.join(dir, `${randomUUID()}.part`);
  let bytes = 0;
  const counter = new Transform({
    transform(chunk: Buffer, _enc, done) {
      bytes += chunk.length;
      done(bytes > maxBytes ? tooLarge(maxBytes) : null, chunk);
    },
  });
  try {
    await pipeline(req, counter, fs.createWriteStream(file, { flags: 'wx' }));
  } catch (err) {
    await fs.promises.rm(file, { force: true });
    if (err instanceof UploadRefusedError) {
      req.resume();
      throw err;
    }
    throw new UploadRefusedError('upload_aborted', 'The upload ended before it was complete; nothing was kept. Try again.');
  }
  if (bytes === 0) {
    await fs.promises.rm(file, { force: true });
    throw new UploadRefusedError('empty_upload', 'The request body is empty; send the snapshot file made by `seamline scan`.');
  }
  return { file, bytes };
}

function tooLarge(maxBytes: number): UploadRefusedError {
  return new UploadRefusedError('upload_too_large', `The upload is larger than the limit of ${formatBytes(maxBytes)}.`, { limit: maxBytes });
}
