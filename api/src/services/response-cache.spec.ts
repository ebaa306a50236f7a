import { gunzipSync } from 'node:zlib';
import { ResponseCache } from './response-cache';

describe('ResponseCache', () => {
  it('should compute an answer once and serve it from memory after, plain and gzipped', async () => {
    const cache = new ResponseCache(4, 1000);
    const compute = jest.fn(async () => ({ nodes: [1, 2] }));
    const first = await cache.get('a', compute);
    expect(first.json.toString('utf8')).toBe('{"nodes":[1,2]}');
    expect(gunzipSync(first.gzipped).toString('utf8')).toBe('{"nodes":[1,2]}');
    expect(await cache.get('a', compute)).toBe(first);
    expect(compute).toHaveBeenCalledTimes(1);
  });

  it('should share one computation between requests that arrive before it ends', async () => {
    const cache = new ResponseCache(4, 1000);
    let finish!: (value: unknown) => void;
    const compute = jest.fn(() => new Promise((resolve) => (finish = resolve)));
    const both = Promise.all([cache.get('a', compute), cache.get('a', compute)]);
    finish([3]);
    const [one, two] = await both;
    expect(one).toBe(two);
    expect(compute).toHaveBeenCalledTimes(1);
  });

  it('should compute again after a failed computation', async () => {
    const cache = new ResponseCache(4, 1000);
    const compute = jest.fn().mockRejectedValueOnce(new Error('database gone')).mockResolvedValue(7);
    await expect(cache.get('a', compute)).rejects.toThrow('database gone');
    expect((await cache.get('a', compute)).json.toString()).toBe('7');
    expect(compute).toHaveBeenCalledTimes(2);
  });

  it('should drop the least recently used answer beyond its entries', async () => {
    const cache = new ResponseCache(2, 1000);
    const compute = jest.fn(async () => 1);
    await cache.get('a', compute);
    await cache.get('b', compute);
    await cache.get('a', compute);
    await cache.get('c', compute);
    await cache.get('a', compute);
    await cache.get('b', compute);
    expect(compute).toHaveBeenCalledTimes(4);
  });

  it('should keep its bytes under the limit and not keep an answer larger than it', async () => {
    const cache = new ResponseCache(10, 30);
    const big = jest.fn(async () => 'x'.repeat(20));
    await cache.get('big', big);
    await cache.get('big', big);
    expect(big).toHaveBeenCalledTimes(2);
  });
});
