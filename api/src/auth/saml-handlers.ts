import type { RequestHandler } from 'express';
import { Passport } from 'passport';
import type { DataSource } from 'typeorm';
import type { Config } from '../config';
import { BadRequestError } from '../errors';
import type { Logger } from '../logger';
import { SignInRefusedError, signInMember } from '../services/sign-in';
import { assertIdpCertPresent, IdentityProviderUnavailableError } from './saml-idp-cert';
import { assertIssuerAndAddress, claimsFromProfile, SamlResponseRejected } from './saml-response-checks';
import { endSession, startSession } from './saml-session';
import { createSamlStrategy } from './saml-strategy';
import { validateSamlResponse } from './saml-validation';

/** What the sign-in routes need. */
export interface AuthDeps {
  config: Config;
  dataSource: DataSource;
  logger: Logger;
}

/** The handlers behind /api/auth; one strategy (and its request-ID cache) per app. */
export function createSamlHandlers({ config, dataSource, logger }: AuthDeps) {
  const strategy = createSamlStrategy(config);
  // A private Passport instance, so two apps in one process (tests) never share a strategy.
  const passport = new Passport();
  passport.use('saml', strategy);

  const login: RequestHandler = async (req, res, next) => {
    if (req.query['SAMLResponse'] !== undefined || req.query['SAMLRequest'] !== undefined) {
      throw new BadRequestError('Sign-in responses are accepted only by POST at /api/auth/saml/acs.');
    }
    await assertIdpCertPresent(config.saml.idpCertFile);
    // On success the strategy answers with the redirect itself; the callback only sees errors.
    passport.authenticate('saml', { session: false }, (err: unknown) => next(err ?? new Error('SAML login produced no redirect')))(req, res, next);
  };

  const acs: RequestHandler = async (req, res) => {
    try {
      if (typeof req.body?.SAMLResponse !== 'string' || req.body.SAMLResponse.length === 0) {
        throw new SamlResponseRejected('The sign-in response was missing.', 'no SAMLResponse in the POST body');
      }
      const profile = await validateSamlResponse(passport, req, res);
      assertIssuerAndAddress(profile, { idpEntityId: config.saml.idpEntityId, acsUrl: config.saml.callbackUrl });
      const member = await signInMember(dataSource, claimsFromProfile(profile), config.demoWorkspaceSlug);
      await startSession(req, member);
      logger.info({ userId: member.userId, workspaceId: member.workspaceId, role: member.role }, 'signed in through SAML');
      res.redirect(303, '/overview');
    } catch (err) {
      // Whatever went wrong, the browser is mid-redirect from the IdP: it gets the sign-in page
      // with a short message, never a JSON error; the reason goes to the log.
      const { message, reason, expected } = describeFailure(err);
      if (expected) logger.warn({ reason }, 'SAML sign-in refused');
      else logger.error({ err }, 'SAML sign-in failed');
      res.redirect(303, `/sign-in?error=${encodeURIComponent(message)}`);
    }
  };

  const logout: RequestHandler = async (req, res) => {
    await endSession(req, res);
    res.status(204).end();
  };

  const metadata: RequestHandler = (_req, res) => {
    res.type('application/samlmetadata+xml').send(strategy.generateServiceProviderMetadata(null, null));
  };

  return { login, acs, logout, metadata };
}

function describeFailure(err: unknown): { message: string; reason: string; expected: boolean } {
  if (err instanceof SamlResponseRejected) return { message: err.publicMessage, reason: err.reason, expected: true };
  if (err instanceof SignInRefusedError || err instanceof IdentityProviderUnavailableError) {
    return { message: err.message, reason: err.message, expected: true };
  }
  return { message: 'Sign-in failed on our side. Please try again in a moment.', reason: String(err), expected: false };
}
