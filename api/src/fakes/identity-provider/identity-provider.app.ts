import express, { type ErrorRequestHandler, type Express } from 'express';
import type { Config } from '../../config';
import { DEMO_PEOPLE } from '../../demo/demo-people';
import type { Logger } from '../../logger';
import { AuthnRequestRefused, readAuthnRequest } from './authn-request';
import { createSignedLoginResponse } from './login-response';
import { sendAutoPostPage, sendErrorPage, sendHomePage, sendSignInPage } from './pages';
import { PendingRequests } from './pending-requests';
import { configuredSp, createIdpEntity } from './saml-entities';
import type { SigningKeys } from './signing-keys';

/**
 * The identity-provider fake: a small SAML IdP (built on samlify) that lets anyone sign in to
 * Seamline as one of the invented demo people. Local use only; it never asks for a password.
 */
export function createIdentityProviderApp(config: Config, keys: SigningKeys, logger?: Logger): Express {
  const idp = createIdpEntity(config, keys);
  const sp = configuredSp(config);
  const pending = new PendingRequests();
  const expected = { spEntityId: config.saml.spEntityId, acsUrl: config.saml.callbackUrl, ssoUrl: config.saml.idpSsoUrl };

  const app = express();
  app.disable('x-powered-by');
  app.use(express.urlencoded({ extended: false, limit: '16kb' }));

  /** GET / — a pointer to the app. */
  app.get('/', (_req, res) => sendHomePage(res, config.publicUrl));

  /** GET /metadata — the IdP's SAML metadata (entity ID, SSO endpoint, signing certificate). */
  app.get('/metadata', (_req, res) => {
    res.type('application/samlmetadata+xml').send(idp.getMetadata());
  });

  /** GET /sso — HTTP-Redirect AuthnRequest from Seamline; answers with the chooser page, 400 if refused. */
  app.get('/sso', async (req, res) => {
    const request = await readAuthnRequest(idp, sp, req.query as Record<string, unknown>, expected);
    pending.add(request.requestId, request.relayState);
    sendSignInPage(res, DEMO_PEOPLE, request.requestId);
  });

  /** POST /sso/login — the chosen person; answers with a signed response posted to the ACS. */
  app.post('/sso/login', async (req, res) => {
    const email = typeof req.body?.email === 'string' ? req.body.email : '';
    const person = DEMO_PEOPLE.find((p) => p.email === email);
    if (!person) throw new AuthnRequestRefused('Choose one of the people on the sign-in page.');
    const request = pending.take(typeof req.body?.requestId === 'string' ? req.body.requestId : '');
    if (!request) {
      throw new AuthnRequestRefused('This sign-in request is unknown, already answered or too old. Start the sign-in again from Seamline.');
    }
    const input = { requestId: request.requestId, person, workspaceSlug: config.demoWorkspaceSlug };
    const response = await createSignedLoginResponse(idp, sp, input, request.relayState);
    logger?.info({ email: person.email, role: person.role, requestId: request.requestId }, 'signed login response issued');
    sendAutoPostPage(res, { acsUrl: response.entityEndpoint, samlResponse: response.context, relayState: response.relayState });
  });

  app.use(pageErrors(config.publicUrl, logger));
  return app;
}

function pageErrors(appUrl: string, logger?: Logger): ErrorRequestHandler {
  return (err, req, res, _next) => {
    if (res.headersSent) return;
    if (err instanceof AuthnRequestRefused) {
      logger?.warn({ url: req.originalUrl.split('?')[0], reason: err.message }, 'sign-in request refused');
      sendErrorPage(res, 400, err.message, appUrl);
      return;
    }
    const status = typeof err?.status === 'number' && err.status >= 400 && err.status < 500 ? err.status : 500;
    if (status === 500) logger?.error({ err }, 'identity-provider fake failed');
    sendErrorPage(res, status, status === 500 ? 'The identity-provider fake failed; the details are in its log.' : 'The request was malformed.', appUrl);
  };
}
