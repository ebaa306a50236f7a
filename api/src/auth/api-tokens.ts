import { createHash, randomBytes } from 'node:crypto';

/** Visible start of every token, so a leaked one is easy to recognise in logs and scanners. */
export const TOKEN_PREFIX = 'sl_';

/** A new secret: shown once to its creator, then only its hash is kept. */
export function newTokenSecret(): string {
  return `${TOKEN_PREFIX}${randomBytes(24).toString('base64url')}`;
}

export function hashToken(secret: string): string {
  return createHash('sha256').update(secret).digest('hex');
}
