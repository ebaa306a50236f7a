/**
 * A small least-recently-used cache of finished JSON answers, for reads of a ready snapshot
 * whose answer can never change (a snapshot's modules and edges are written once). Bounded by
 * entries and by bytes so a few very large module graphs cannot hold the API's memory.
 */
export class ResponseCache {
  private readonly entries = new Map<string, string>();
  private bytes = 0;

  constructor(private readonly maxEntries: number, private readonly maxBytes: number) {}

  async get(key: string, compute: () => Promise<unknown>): Promise<string> {
    const hit = this.entries.get(key);
    if (hit !== undefined) {
      this.entries.delete(key);
      this.entries.set(key, hit);
      return hit;
    }
    const json = JSON.stringify(await compute());
    if (json.length <= this.maxBytes) {
      this.entries.set(key, json);
      this.bytes += json.length;
      while (this.entries.size > this.maxEntries || this.bytes > this.maxBytes) {
        const [oldest, value] = this.entries.entries().next().value!;
        this.entries.delete(oldest);
        this.bytes -= value.length;
      }
    }
    return json;
  }
}
