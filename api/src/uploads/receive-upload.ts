import busboy from 'busboy';
import type { Request } from 'express';
import { randomUUID } from 'node:crypto';
import { createWriteStream, type WriteStream } from 'node:fs';
import { mkdir, rm } from 'node:fs/promises';
import * as path from 'node:path';
import type { Readable } from 'node:stream';
import { formatBytes } from './byte-size';
import type { UploadLimits } from './upload-limits';
import { UploadRefusedError } from './upload-errors';

export interface ReceiveUploadOptions {
  /** Where the upload is written, under a new random name; created if missing. */
  dir: string;
  limits: UploadLimits;
  /** The multipart field that carries the zip; `file` by default. */
  fileField?: string;
}

export interface ReceivedUpload {
  /** Absolute path of the stored upload; the caller owns it from here. */
  file: string;
  bytes: number;
  /** The file name the client gave, without any folders; empty if it gave none. */
  originalName: string;
  /** The text fields sent with the file. */
  fields: Record<string, string>;
}

/** Text fields are for small things such as a name; anything bigger is a mistake or an attack. */
const MAX_FIELDS = 20;
const MAX_FIELD_BYTES = 8 * 1024;
const MAX_FIELD_NAME_BYTES = 100;

/**
 * Streams the one file of a multipart/form-data request to a new file in `dir`, never holding it
 * in memory, and refuses with an UploadRefusedError anything that is not exactly one non-empty
 * file within `limits.maxUploadBytes`. On any failure the partial file is deleted before the
 * promise rejects; a client that goes away mid-upload rejects it with `upload_aborted`.
 */
export async function receiveZipUpload(req: Request, options: ReceiveUploadOptions): Promise<ReceivedUpload> {
  const fileField = options.fileField ?? 'file';
  const contentType = req.headers['content-type'];
  if (!contentType || !/^multipart\/form-data\s*(;|$)/i.test(contentType)) {
    const sent = contentType ? `as ${JSON.stringify(contentType)}` : 'without a Content-Type';
    throw new UploadRefusedError('not_multipart', `Send the zip as multipart/form-data with the file in the "${fileField}" field; this request came ${sent}.`);
  }
  if (req.readableEnded) throw new Error('receiveZipUpload: the request body was already read by an earlier handler.');
  await mkdir(options.dir, { recursive: true });
  return new UploadReception(req, path.resolve(options.dir), fileField, options.limits).result;
}

/** One request's upload: parses it, writes the file, and settles exactly once. */
class UploadReception {
  readonly result: Promise<ReceivedUpload>;
  private resolve!: (upload: ReceivedUpload) => void;
  private reject!: (err: unknown) => void;
  private readonly target: string;
  private readonly fields = new Map<string, string>();
  private parser?: busboy.Busboy;
  private out?: WriteStream;
  private originalName = '';
  private parsed = false;
  private written = false;
  private settled = false;

  constructor(
    private readonly req: Request,
    dir: string,
    private readonly fileField: string,
    private readonly limits: UploadLimits,
  ) {
    this.result = new Promise((resolve, reject) => {
      this.resolve = resolve;
      this.reject = reject;
    });
    this.target = path.join(dir, `${randomUUID()}.zip`);
    req.on('close', () => {
      if (!req.complete) this.fail(aborted());
    });
    req.on('error', () => this.fail(aborted()));
    try {
      this.parser = busboy({
        headers: req.headers,
        limits: {
          files: 1,
          // busboy flags a part that reaches the limit, so one byte more lets a file be exactly the limit.
          fileSize: limits.maxUploadBytes + 1,
          fields: MAX_FIELDS,
          fieldSize: MAX_FIELD_BYTES + 1,
          fieldNameSize: MAX_FIELD_NAME_BYTES + 1,
        },
      });
    } catch (err) {
      this.fail(badMultipart(err));
      return;
    }
    this.parser
      .on('file', (name, stream, info) => this.onFile(name, stream, info))
      .on('field', (name, value, info) => this.onField(name, value, info))
      .on('filesLimit', () =>
        this.fail(new UploadRefusedError('too_many_files', `The upload has more than one file; send only the zip, in the "${fileField}" field.`)),
      )
      .on('fieldsLimit', () => this.fail(new UploadRefusedError('bad_field', `The upload has more than ${MAX_FIELDS} text fields, the limit.`)))
      .on('error', (err) => this.fail(badMultipart(err)))
      .on('close', () => {
        this.parsed = true;
        this.finishIfDone();
      });
    req.pipe(this.parser);
  }

  private onFile(name: string, stream: Readable, info: busboy.FileInfo): void {
    // busboy ends a cut-short part by destroying its stream with an error.
    stream.on('error', (err) => this.fail(badMultipart(err)));
    if (this.settled) {
      stream.resume();
      return;
    }
    if (name !== this.fileField) {
      stream.resume();
      this.fail(new UploadRefusedError('unexpected_file', `The upload has a file in the "${name}" field; send the zip in the "${this.fileField}" field.`));
      return;
    }
    this.originalName = info.filename ?? '';
    const out = createWriteStream(this.target, { flags: 'wx', mode: 0o600 });
    this.out = out;
    out.on('error', (err) => this.fail(err));
    out.on('close', () => {
      if (!out.writableFinished) return;
      this.written = true;
      this.finishIfDone();
    });
    stream.on('limit', () => {
      const max = this.limits.maxUploadBytes;
      this.fail(
        new UploadRefusedError(
          'upload_too_large',
          `The upload is larger than ${formatBytes(max)}, the limit, so nothing was kept. Leave dependencies and build output (such as node_modules and dist) out of the zip and try again.`,
          { limit: max },
        ),
      );
    });
    stream.pipe(out);
  }

  private onField(name: string, value: string, info: busboy.FieldInfo): void {
    if (info.nameTruncated) {
      this.fail(new UploadRefusedError('bad_field', `A text field's name is longer than ${MAX_FIELD_NAME_BYTES} bytes, the limit.`));
    } else if (info.valueTruncated) {
      this.fail(new UploadRefusedError('bad_field', `The "${name}" field is longer than ${formatBytes(MAX_FIELD_BYTES)}, the limit for a text field.`));
    } else if (this.fields.has(name)) {
      this.fail(new UploadRefusedError('bad_field', `The "${name}" field is sent more than once; send it once.`));
    } else {
      this.fields.set(name, value);
    }
  }

  /** Resolves once the form is fully parsed and the file fully written and closed. */
  private finishIfDone(): void {
    if (this.settled || !this.parsed) return;
    if (!this.out) {
      this.fail(new UploadRefusedError('no_file', `The upload has no file in the "${this.fileField}" field; attach the zip there.`));
      return;
    }
    if (!this.written) return;
    const bytes = this.out.bytesWritten;
    if (bytes === 0) {
      this.fail(new UploadRefusedError('empty_upload', 'The uploaded file is empty. Choose the zip of your codebase and upload it again.'));
      return;
    }
    this.settled = true;
    // fromEntries defines each field as an own property, so a field named "__proto__" stays a field.
    this.resolve({ file: this.target, bytes, originalName: this.originalName, fields: Object.fromEntries(this.fields) });
  }

  private fail(err: unknown): void {
    if (this.settled) return;
    this.settled = true;
    this.stopReading();
    this.discardFile().then(
      () => this.reject(err),
      (rmErr: unknown) => this.reject(rmErr),
    );
  }

  /**
   * Reads and drops what the client still sends, so it finishes sending and sees the refusal;
   * a client sending much more than the limit is cut off instead.
   */
  private stopReading(): void {
    const { req } = this;
    if (this.parser) req.unpipe(this.parser);
    if (req.readableEnded || req.destroyed) return;
    let dropped = 0;
    req.on('data', (chunk: Buffer) => {
      dropped += chunk.length;
      if (dropped > this.limits.maxUploadBytes) req.destroy();
    });
    req.resume();
  }

  private async discardFile(): Promise<void> {
    const out = this.out;
    if (out && !out.closed) {
      await new Promise<void>((resolve) => {
        out.once('close', () => resolve());
        out.destroy();
      });
    }
    await rm(this.target, { force: true });
  }
}

function aborted(): UploadRefusedError {
  return new UploadRefusedError('upload_aborted', 'The upload stopped before it was complete, so nothing was kept. Try again.');
}

function badMultipart(err: unknown): UploadRefusedError {
  const why = err instanceof Error ? err.message : String(err);
  return new UploadRefusedError('bad_multipart', `The upload could not be read as multipart/form-data (${why}). Send the zip as an ordinary file upload.`);
}
