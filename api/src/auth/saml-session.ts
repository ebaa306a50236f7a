import type { Request, Response } from 'express';
import type { SignedInMember } from '../services/sign-in';
import { newCsrfToken } from './csrf';
import './session-data';

/** The session cookie's name; must match the `name` given to express-session in app.ts. */
export const SESSION_COOKIE = 'seamline.sid';

/**
 * Starts a fresh session for the member: a new session ID is issued on every sign-in (rotation),
 * so an ID planted before sign-in is worthless afterwards. The session gets its anti-forgery
 * token now, complete: express-session writes a regenerated session once more as the sign-in
 * response ends, after the redirect's headers have gone out, and that late write replaced a token
 * the first request after the redirect had just added — the member's first change then failed
 * with 403 (seen in the end-to-end tests). With nothing left to add, both writes are the same.
 */
export async function startSession(req: Request, member: SignedInMember): Promise<void> {
  await new Promise<void>((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
  req.session.userId = member.userId;
  req.session.workspaceId = member.workspaceId;
  req.session.csrfToken = newCsrfToken();
  await new Promise<void>((resolve, reject) => req.session.save((err) => (err ? reject(err) : resolve())));
}

/** Deletes the session from the store and tells the browser to drop its cookie. */
export async function endSession(req: Request, res: Response): Promise<void> {
  const cookie = req.session?.cookie;
  if (req.session) {
    await new Promise<void>((resolve, reject) => req.session.destroy((err) => (err ? reject(err) : resolve())));
  }
  res.clearCookie(SESSION_COOKIE, {
    path: cookie?.path ?? '/',
    httpOnly: true,
    secure: cookie?.secure === true,
    sameSite: cookie?.sameSite ?? 'lax',
  });
}
