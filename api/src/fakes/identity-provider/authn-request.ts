import type { IdentityProviderInstance, ServiceProviderInstance } from 'samlify';

/** Why the fake will not answer a request; shown to the person as a 400 page. */
export class AuthnRequestRefused extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'AuthnRequestRefused';
  }
}

/** The parts of a validated AuthnRequest the fake needs to answer it. */
export interface ValidAuthnRequest {
  requestId: string;
  relayState?: string;
}

/** Where Seamline's AuthnRequests must come from and point to. */
export interface Expected {
  spEntityId: string;
  acsUrl: string;
  ssoUrl: string;
}

/**
 * Parses and schema-validates an HTTP-Redirect AuthnRequest with samlify, then checks what samlify
 * leaves to the caller: that the issuer is the one known service provider and that the requested
 * ACS URL and Destination are the configured ones (so a response is never sent elsewhere).
 */
export async function readAuthnRequest(
  idp: IdentityProviderInstance,
  sp: ServiceProviderInstance,
  query: Record<string, unknown>,
  expected: Expected,
): Promise<ValidAuthnRequest> {
  const { SAMLRequest: samlRequest, RelayState: relayState } = query;
  if (typeof samlRequest !== 'string' || samlRequest.length === 0) {
    throw new AuthnRequestRefused('This address expects a SAML AuthnRequest from Seamline, and the SAMLRequest parameter is missing. Start the sign-in from Seamline.');
  }
  if (relayState !== undefined && (typeof relayState !== 'string' || relayState.length > 512)) {
    throw new AuthnRequestRefused('The RelayState parameter is malformed.');
  }
  let extract: Record<string, unknown>;
  try {
    ({ extract } = await idp.parseLoginRequest(sp, 'redirect', { query: { SAMLRequest: samlRequest } }));
  } catch (err) {
    throw new AuthnRequestRefused(`The SAML AuthnRequest could not be read or is not valid SAML (${reason(err)}).`);
  }
  const request = (extract['request'] ?? {}) as Record<string, unknown>;
  const issuer = extract['issuer'];
  if (issuer !== expected.spEntityId) {
    throw new AuthnRequestRefused(`The AuthnRequest comes from “${String(issuer ?? 'no issuer')}”, a service provider this identity provider does not know. It only serves ${expected.spEntityId}.`);
  }
  const acs = request['assertionConsumerServiceUrl'];
  if (acs !== undefined && acs !== expected.acsUrl) {
    throw new AuthnRequestRefused(`The AuthnRequest asks for the answer at ${String(acs)}, but Seamline's assertion consumer service is ${expected.acsUrl}.`);
  }
  const destination = request['destination'];
  if (destination !== undefined && destination !== expected.ssoUrl) {
    throw new AuthnRequestRefused(`The AuthnRequest is addressed to ${String(destination)}, not to this identity provider (${expected.ssoUrl}).`);
  }
  const requestId = request['id'];
  if (typeof requestId !== 'string' || requestId.length === 0 || requestId.length > 256) {
    throw new AuthnRequestRefused('The AuthnRequest has no usable ID.');
  }
  return { requestId, relayState: relayState as string | undefined };
}

function reason(err: unknown): string {
  return err instanceof Error ? err.message : String(err);
}
