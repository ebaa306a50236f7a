import connectPgSimple from 'connect-pg-simple';
import session, { type SessionData } from 'express-session';
import type { Pool } from 'pg';

/** How long a session's stored expiry may lag behind its rolling cookie (sessions last 8 hours). */
export const TOUCH_AFTER_MS = 60_000;
/** Sessions whose last touch is remembered; beyond this the oldest are forgotten (and touched again). */
const REMEMBERED = 10_000;

const PgStore = connectPgSimple(session);

/**
 * Sessions in PostgreSQL (connect-pg-simple), with rolling expiry written at most once a minute
 * per session and API process. express-session touches the store at the end of every request
 * whose session did not change, and an UPDATE (one commit, one WAL flush) on every read of
 * the API is work no one needs: the session lives 8 hours, so a minute's lag is harmless. Other
 * session stores offer the same as a `touchAfter` setting.
 */
export class SessionStore extends PgStore {
  private readonly touched = new Map<string, number>();

  constructor(pool: Pool, private readonly now: () => number = Date.now) {
    super({ pool, tableName: 'http_session', createTableIfMissing: false });
  }

  override touch(sid: string, sess: SessionData, callback?: () => void): void {
    const last = this.touched.get(sid);
    const now = this.now();
    if (last !== undefined && now - last < TOUCH_AFTER_MS) {
      callback?.();
      return;
    }
    this.touched.delete(sid);
    this.touched.set(sid, now);
    if (this.touched.size > REMEMBERED) this.touched.delete(this.touched.keys().next().value!);
    super.touch(sid, sess, callback);
  }

  override destroy(sid: string, callback?: (err?: unknown) => void): void {
    this.touched.delete(sid);
    super.destroy(sid, callback);
  }
}
