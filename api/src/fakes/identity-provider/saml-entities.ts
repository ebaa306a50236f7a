import { randomUUID } from 'node:crypto';
import {
  Constants,
  IdentityProvider,
  SamlLib,
  ServiceProvider,
  setSchemaValidator,
  type IdentityProviderInstance,
  type ServiceProviderInstance,
} from 'samlify';
import type { Config } from '../../config';
import { quietly } from './quiet-console';
import { validateSamlSchema } from './schema-validator';
import type { SigningKeys } from './signing-keys';

const EMAIL_FORMAT = Constants.namespace.format.emailAddress;
const BASIC = 'urn:oasis:names:tc:SAML:2.0:attrname-format:basic';

/** The SAML attributes every response carries; `valueTag` becomes the template tag `attr<Tag>`. */
const ATTRIBUTES = [
  { name: 'email', valueTag: 'email' },
  { name: 'displayName', valueTag: 'name' },
  { name: 'role', valueTag: 'role' },
  { name: 'workspace', valueTag: 'workspace' },
].map((a) => ({ ...a, nameFormat: BASIC, valueXsiType: 'xs:string' }));

// The default template leaves {AuthnStatement} to the caller; the fake states how it "authenticated".
const AUTHN_STATEMENT =
  '<saml:AuthnStatement AuthnInstant="{IssueInstant}" SessionIndex="{AssertionID}"><saml:AuthnContext>' +
  '<saml:AuthnContextClassRef>urn:oasis:names:tc:SAML:2.0:ac:classes:unspecified</saml:AuthnContextClassRef>' +
  '</saml:AuthnContext></saml:AuthnStatement>';

let validatorSet = false;

/** samlify refuses to parse any message until a schema validator is registered (once per process). */
export function useSchemaValidator(): void {
  if (validatorSet) return;
  setSchemaValidator({ validate: validateSamlSchema });
  validatorSet = true;
}

/** The fake's own SAML identity: its entity ID, SSO endpoint, signing key and response template. */
export function createIdpEntity(config: Config, keys: SigningKeys, entityId = config.saml.idpEntityId): IdentityProviderInstance {
  useSchemaValidator();
  // No IdP session is kept, so no single logout is offered; samlify warns about that each time.
  return quietly(['warn'], () => IdentityProvider({
    entityID: entityId,
    privateKey: keys.privateKey,
    signingCert: keys.cert,
    nameIDFormat: [EMAIL_FORMAT],
    wantAuthnRequestsSigned: false,
    singleSignOnService: [{ Binding: Constants.namespace.binding.redirect, Location: config.saml.idpSsoUrl }],
    generateID: () => `_${randomUUID()}`,
    loginResponseTemplate: {
      context: SamlLib.defaultLoginResponseTemplate.context.replace('{AuthnStatement}', AUTHN_STATEMENT),
      attributes: ATTRIBUTES,
    },
  }));
}

/**
 * The one service provider the fake answers: Seamline's API as configured. Both the response and
 * the assertion are signed for it, which is what the API's SAML library demands by default.
 */
export function createSpEntity(target: { entityId: string; acsUrl: string }): ServiceProviderInstance {
  useSchemaValidator();
  return ServiceProvider({
    entityID: target.entityId,
    assertionConsumerService: [{ Binding: Constants.namespace.binding.post, Location: target.acsUrl }],
    nameIDFormat: [EMAIL_FORMAT],
    authnRequestsSigned: false,
    wantAssertionsSigned: true,
    wantMessageSigned: true,
  });
}

/** The service provider as Seamline's configuration describes it. */
export function configuredSp(config: Config): ServiceProviderInstance {
  return createSpEntity({ entityId: config.saml.spEntityId, acsUrl: config.saml.callbackUrl });
}

