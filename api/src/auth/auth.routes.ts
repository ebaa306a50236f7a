import { Router } from 'express';
import { createSamlHandlers, type AuthDeps } from './saml-handlers';

/** Sign-in and sign-out through SAML; public (mounted before `requireSession`). */
export function authRoutes(deps: AuthDeps): Router {
  const { login, acs, logout, metadata } = createSamlHandlers(deps);
  const router = Router();
  /** GET /api/auth/login — anyone: redirects to the identity provider; 503 if its certificate is missing. */
  router.get('/login', login);
  /** POST /api/auth/saml/acs — the identity provider (via the browser): 303 to /overview, or to /sign-in?error=… */
  router.post('/saml/acs', acs);
  /** POST /api/auth/logout — anyone: ends the session, 204. */
  router.post('/logout', logout);
  /** GET /api/auth/saml/metadata — anyone: the service provider's SAML metadata. */
  router.get('/saml/metadata', metadata);
  return router;
}
