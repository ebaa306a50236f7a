import { pushUrl, sendsTokenInClear, snapshotUrl } from './pushEndpoints';

describe('pushUrl', () => {
  it('should put the codebase in the query and leave out commit and branch when not given', () => {
    expect(pushUrl({ server: 'https://s.example.com', codebase: 'web' }).href).toBe('https://s.example.com/api/push?codebase=web');
  });

  it('should encode every value so the server reads back exactly what was given', () => {
    const url = pushUrl({ server: 'https://s.example.com/seamline', codebase: 'Otterbay & Co/web?x=1#y', commit: 'a1b2c3', branch: 'feature/größe 2' });
    expect(url.pathname).toBe('/seamline/api/push');
    expect(Object.fromEntries(url.searchParams)).toEqual({ codebase: 'Otterbay & Co/web?x=1#y', commit: 'a1b2c3', branch: 'feature/größe 2' });
    expect(url.search).toBe('?codebase=Otterbay+%26+Co%2Fweb%3Fx%3D1%23y&commit=a1b2c3&branch=feature%2Fgr%C3%B6%C3%9Fe+2');
  });
});

describe('snapshotUrl', () => {
  it("should address the snapshot's status under the server", () => {
    expect(snapshotUrl('http://127.0.0.1:3000', '0b8e2c1e-5d3f-4a51-9c1e-2f6f1b0c9a77')).toBe(
      'http://127.0.0.1:3000/api/snapshots/0b8e2c1e-5d3f-4a51-9c1e-2f6f1b0c9a77',
    );
    expect(snapshotUrl('http://h', 'a/b')).toBe('http://h/api/snapshots/a%2Fb');
  });
});

describe('sendsTokenInClear', () => {
  it.each<[string, boolean]>([
    ['https://seamline.example.com', false],
    ['http://localhost:3000', false],
    ['http://api.localhost', false],
    ['http://127.0.0.1:3000', false],
    ['http://[::1]:3000', false],
    ['http://seamline.example.com', true],
    ['http://10.0.0.5', true],
  ])('%s → %s', (server, clear) => {
    expect(sendsTokenInClear(server)).toBe(clear);
  });
});
