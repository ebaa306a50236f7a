import { randomUUID } from 'node:crypto';
import type { Pool } from 'pg';
// express-session signs its cookie with this package; tests sign the same way.
import { sign } from 'cookie-signature';
import { SESSION_COOKIE } from '../auth/saml-session';
import type { Config } from '../config';

/**
 * A session cookie for a member, written straight into the session table, so route tests need
 * not repeat the SAML round trip (that flow has its own tests in auth/).
 */
export async function sessionCookieFor(pool: Pool, config: Config, userId: string, workspaceId: string): Promise<string> {
  const sid = randomUUID();
  const expires = new Date(Date.now() + 60 * 60 * 1000);
  const sess = { cookie: { originalMaxAge: 3600000, expires: expires.toISOString(), httpOnly: true, path: '/', sameSite: 'lax' }, userId, workspaceId };
  await pool.query('INSERT INTO http_session (sid, sess, expire) VALUES ($1, $2, $3)', [sid, JSON.stringify(sess), expires]);
  return `${SESSION_COOKIE}=${encodeURIComponent(`s:${sign(sid, config.sessionSecret)}`)}`;
}
