import { promisify } from 'node:util';
import { gzip } from 'node:zlib';

const gzipAsync = promisify(gzip);

/** A finished JSON answer, as UTF-8 bytes and gzip-compressed once for clients that accept it. */
export interface CachedJson {
  json: Buffer;
  gzipped: Buffer;
}

/**
 * A small least-recently-used cache of finished JSON answers, for reads of a ready snapshot
 * whose answer can never change (a snapshot's modules and edges are written once). Bounded by
 * entries and by bytes so a few very large module graphs cannot hold the API's memory. Each
 * answer is compressed once (a 5,000-module map is megabytes of repetitive JSON, and sending it
 * dominates its cost), and concurrent first requests for one key share one computation.
 */
export class ResponseCache {
  private readonly entries = new Map<string, CachedJson>();
  private readonly pending = new Map<string, Promise<CachedJson>>();
  private bytes = 0;

  constructor(private readonly maxEntries: number, private readonly maxBytes: number) {}

  async get(key: string, compute: () => Promise<unknown>): Promise<CachedJson> {
    const hit = this.entries.get(key);
    if (hit !== undefined) {
      this.entries.delete(key);
      this.entries.set(key, hit);
      return hit;
    }
    let running = this.pending.get(key);
    if (running === undefined) {
      running = this.build(key, compute).finally(() => this.pending.delete(key));
      this.pending.set(key, running);
    }
    return running;
  }

  private async build(key: string, compute: () => Promise<unknown>): Promise<CachedJson> {
    const json = Buffer.from(JSON.stringify(await compute()), 'utf8');
    const answer = { json, gzipped: await gzipAsync(json) };
    const size = json.length + answer.gzipped.length;
    if (size <= this.maxBytes) {
      this.entries.set(key, answer);
      this.bytes += size;
      while (this.entries.size > this.maxEntries || this.bytes > this.maxBytes) {
        const [oldest, value] = this.entries.entries().next().value!;
        this.entries.delete(oldest);
        this.bytes -= value.json.length + value.gzipped.length;
      }
    }
    return answer;
  }
}
