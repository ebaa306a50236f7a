import { Transform, type TransformCallback } from 'node:stream';
import { crc32 } from 'node:zlib';
import { formatBytes } from './byte-size';
import { refuseEntry } from './upload-errors';

/**
 * Passes an entry's unpacked bytes through while counting them, so a header that understates
 * the size is caught as soon as the data outgrows it, and a short or altered entry at its end.
 */
export class EntryByteGuard extends Transform {
  private bytes = 0;
  private crc = 0;

  constructor(
    private readonly name: string,
    private readonly declaredBytes: number,
    private readonly declaredCrc: number,
  ) {
    super();
  }

  override _transform(chunk: Buffer, _encoding: BufferEncoding, done: TransformCallback): void {
    this.bytes += chunk.length;
    if (this.bytes > this.declaredBytes) {
      done(
        refuseEntry(
          'zip_bomb',
          this.name,
          `it unpacks to more than the ${formatBytes(this.declaredBytes)} its header declares; understated sizes are how zip bombs slip past limits.`,
        ),
      );
      return;
    }
    this.crc = crc32(chunk, this.crc);
    done(null, chunk);
  }

  override _flush(done: TransformCallback): void {
    if (this.bytes < this.declaredBytes) {
      done(refuseEntry('damaged_zip', this.name, `it unpacks to ${formatBytes(this.bytes)}, less than the ${formatBytes(this.declaredBytes)} its header declares; the zip is damaged.`));
      return;
    }
    if (this.crc >>> 0 !== this.declaredCrc >>> 0) {
      done(refuseEntry('damaged_zip', this.name, 'its contents do not match their checksum; the zip is damaged.'));
      return;
    }
    done();
  }
}
