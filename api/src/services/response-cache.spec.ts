import { ResponseCache } from './response-cache';

describe('ResponseCache', () => {
  it('should compute an answer once and serve it from memory after', async () => {
    const cache = new ResponseCache(4, 1000);
    const compute = jest.fn(async () => ({ nodes: [1, 2] }));
    expect(await cache.get('a', compute)).toBe('{"nodes":[1,2]}');
    expect(await cache.get('a', compute)).toBe('{"nodes":[1,2]}');
    expect(compute).toHaveBeenCalledTimes(1);
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
    const cache = new ResponseCache(10, 10);
    const big = jest.fn(async () => 'x'.repeat(20));
    await cache.get('big', big);
    await cache.get('big', big);
    expect(big).toHaveBeenCalledTimes(2);
  });
});
