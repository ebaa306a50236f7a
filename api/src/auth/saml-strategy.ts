import { Strategy, ValidateInResponseTo, type VerifyWithoutRequest } from '@node-saml/passport-saml';
import type { Config } from '../config';
import { readIdpCert } from './saml-idp-cert';

const EMAIL_FORMAT = 'urn:oasis:names:tc:SAML:1.1:nameid-format:emailAddress';

/**
 * Seamline's SAML service provider. Every value here must match the identity provider's view:
 * issuer = our entity ID = the assertion's Audience, callbackUrl = ACS = Destination and Recipient,
 * idpIssuer = the IdP's entity ID. node-saml checks neither the login response's Issuer nor its
 * Destination/Recipient: `saml-response-checks` does.
 */
export function createSamlStrategy(config: Config): Strategy {
  const { saml } = config;
  return new Strategy(
    {
      entryPoint: saml.idpSsoUrl,
      issuer: saml.spEntityId,
      callbackUrl: saml.callbackUrl,
      audience: saml.spEntityId,
      idpIssuer: saml.idpEntityId,
      idpCert: (done) => {
        readIdpCert(saml.idpCertFile).then((pem) => done(null, pem), (err: Error) => done(err));
      },
      identifierFormat: EMAIL_FORMAT,
      wantAssertionsSigned: true,
      wantAuthnResponseSigned: true,
      validateInResponseTo: ValidateInResponseTo.always,
      // Request IDs live in this process's memory: a second API instance needs a shared cacheProvider.
      requestIdExpirationPeriodMs: 10 * 60_000,
      acceptedClockSkewMs: 5_000,
      // The fake asks for no password, so requesting PasswordProtectedTransport would be a lie.
      disableRequestedAuthnContext: true,
      signatureAlgorithm: 'sha256',
    },
    passProfileThrough,
    passProfileThrough,
  );
}

// The strategy only validates; turning the profile into a session is the route's job.
const passProfileThrough: VerifyWithoutRequest = (profile, done) => {
  done(null, (profile ?? undefined) as unknown as Record<string, unknown> | undefined);
};
