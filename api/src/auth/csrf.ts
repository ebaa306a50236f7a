import { randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, Response } from 'express';
import { ForbiddenError } from '../errors';
import './session-data';

/** Angular's HttpClient reads this cookie and echoes it in this header on every change. */
export const CSRF_COOKIE = 'XSRF-TOKEN';
export const CSRF_HEADER = 'x-xsrf-token';
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/** A fresh anti-forgery token (sessions get theirs when they start; see startSession). */
export function newCsrfToken(): string {
  return randomBytes(24).toString('base64url');
}

/**
 * Cross-site request forgery guard for cookie sessions (double submit, bound to the session):
 * the session keeps a random token, the browser gets it in a cookie only same-origin script can
 * read, and every state-changing request must send it back in a header. A forged cross-site form
 * or fetch cannot read the cookie, so it cannot set the header.
 */
export function checkCsrf(req: Request, res: Response): void {
  const session = req.session;
  if (!session.csrfToken) session.csrfToken = newCsrfToken();
  res.cookie(CSRF_COOKIE, session.csrfToken, { sameSite: 'strict', secure: req.secure, httpOnly: false, path: '/' });
  if (SAFE_METHODS.has(req.method)) return;
  // Compared as bytes: a header of the same length in characters may differ in bytes.
  const sent = Buffer.from(req.get(CSRF_HEADER) ?? '');
  const expected = Buffer.from(session.csrfToken);
  if (sent.length !== expected.length || !timingSafeEqual(sent, expected)) {
    throw new ForbiddenError('This change did not carry the page\'s anti-forgery token (X-XSRF-TOKEN); reload the page and try again.');
  }
}
