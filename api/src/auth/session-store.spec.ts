import type { SessionData } from 'express-session';
import type { Pool } from 'pg';
import { SessionStore, TOUCH_AFTER_MS } from './session-store';

describe('SessionStore', () => {
  const session = { cookie: { originalMaxAge: 1000, expires: new Date(Date.now() + 1000) } } as unknown as SessionData;
  let clock: number;
  let updates: unknown[][];
  let store: SessionStore;

  beforeEach(() => {
    clock = 1_000_000;
    updates = [];
    const pool = {
      query: jest.fn(async (text: string, params: unknown[]) => {
        if (text.startsWith('UPDATE')) updates.push(params);
        return { rows: [{ sid: params[1] }] };
      }),
    } as unknown as Pool;
    store = new SessionStore(pool, () => clock);
  });
  afterEach(() => store.close());

  const touch = (sid: string) => new Promise<void>((resolve) => store.touch(sid, session, () => resolve()));

  it('should write a session\'s expiry at most once a minute', async () => {
    await touch('a');
    await touch('a');
    clock += TOUCH_AFTER_MS - 1;
    await touch('a');
    expect(updates).toHaveLength(1);
    clock += 1;
    await touch('a');
    expect(updates).toHaveLength(2);
  });

  it('should touch each session on its own clock', async () => {
    await touch('a');
    await touch('b');
    await touch('a');
    expect(updates.map((params) => params[1])).toEqual(['a', 'b']);
  });

  it('should write again for a session destroyed and signed in anew under the same id', async () => {
    await touch('a');
    await new Promise<void>((resolve) => store.destroy('a', () => resolve()));
    await touch('a');
    expect(updates).toHaveLength(2);
  });
});
