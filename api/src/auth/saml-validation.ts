import type { Profile } from '@node-saml/passport-saml';
import type { Request, Response } from 'express';
import type { Passport } from 'passport';
import { IdentityProviderUnavailableError } from './saml-idp-cert';
import { SamlResponseRejected } from './saml-response-checks';

/** What each kind of node-saml refusal means to the person; the first match wins. */
const MESSAGES: [RegExp, string][] = [
  [/expired|not yet valid|too old|no valid subject confirmation/i, 'The sign-in response has expired. Please sign in again.'],
  [/InResponseTo/i, 'The sign-in response does not answer a current sign-in request (it may have been used already). Please sign in again.'],
  [/audience/i, 'The sign-in response was meant for another application.'],
  [/issuer/i, 'The sign-in response comes from an identity provider Seamline does not trust.'],
  [/status/i, 'The identity provider did not sign you in.'],
];
const FALLBACK = 'The sign-in response could not be verified.';

/**
 * Runs the SAML strategy on a POSTed SAMLResponse: signatures (response and assertion), times,
 * audience, issuer and InResponseTo. Resolves with the profile; rejects with `SamlResponseRejected`
 * (or `IdentityProviderUnavailableError` when the IdP certificate is missing).
 */
export function validateSamlResponse(passport: InstanceType<typeof Passport>, req: Request, res: Response): Promise<Profile> {
  return new Promise((resolve, reject) => {
    const done = (err: unknown, user: unknown) => {
      if (err) reject(asRejection(err));
      else if (!user) reject(new SamlResponseRejected(FALLBACK, 'the strategy returned no profile'));
      else resolve(user as Profile);
    };
    passport.authenticate('saml', { session: false }, done)(req, res, (err?: unknown) =>
      reject(err ? asRejection(err) : new SamlResponseRejected(FALLBACK, 'the strategy passed the request on')),
    );
  });
}

function asRejection(err: unknown): Error {
  if (err instanceof IdentityProviderUnavailableError || err instanceof SamlResponseRejected) return err;
  const reason = err instanceof Error ? err.message : String(err);
  const message = MESSAGES.find(([pattern]) => pattern.test(reason))?.[1] ?? FALLBACK;
  return new SamlResponseRejected(message, reason);
}
