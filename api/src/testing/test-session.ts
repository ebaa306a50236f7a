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
  return (await memberSession(pool, config, userId, workspaceId)).cookie;
}

/** A member's session cookie and the anti-forgery token its changes must send (as `headers`). */
export async function memberSession(pool: Pool, config: Config, userId: string, workspaceId: string) {
  const sid = randomUUID();
  const csrf = randomUUID();
  const expires = new Date(Date.now() + 60 * 60 * 1000);
  const sess = { cookie: { originalMaxAge: 3600000, expires: expires.toISOString(), httpOnly: true, path: '/', sameSite: 'lax' }, userId, workspaceId, csrfToken: csrf };
  await pool.query('INSERT INTO http_session (sid, sess, expire) VALUES ($1, $2, $3)', [sid, JSON.stringify(sess), expires]);
  const cookie = `${SESSION_COOKIE}=${encodeURIComponent(`s:${sign(sid, config.sessionSecret)}`)}`;
  return { cookie, csrf, headers: { Cookie: cookie, 'X-XSRF-TOKEN': csrf } };
}
