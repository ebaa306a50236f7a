import type { Profile } from '@node-saml/passport-saml';
import { Extractor } from 'samlify';
import type { SignInClaims } from '../services/sign-in';

/** A validated response that still may not sign anyone in; the message is safe to show. */
export class SamlResponseRejected extends Error {
  constructor(
    readonly publicMessage: string,
    readonly reason: string,
  ) {
    super(reason);
    this.name = 'SamlResponseRejected';
  }
}

const CONFIRMATION_PATH = ['Assertion', 'Subject', 'SubjectConfirmation', 'SubjectConfirmationData'];

/** Who must have issued a response and where it must be addressed. */
export interface ExpectedEnvelope {
  idpEntityId: string;
  acsUrl: string;
}

/**
 * node-saml 5 checks signatures, times, audience and InResponseTo, but on login responses it
 * checks neither the Issuer (`idpIssuer` is only applied to logout messages) nor where the
 * response was meant to go. So: the assertion's Issuer (and the Response's, when present) must be
 * the configured IdP; Destination (on the signed Response) and every Recipient (in the signed
 * assertion) must be our ACS URL, so a response minted for another service provider is useless here.
 */
export function assertIssuerAndAddress(profile: Profile, expected: ExpectedEnvelope): void {
  const responseXml = profile.getSamlResponseXml?.();
  const assertionXml = profile.getAssertionXml?.();
  if (!responseXml || !assertionXml) {
    throw new SamlResponseRejected('The sign-in response could not be verified.', 'response or assertion XML unavailable');
  }
  const envelope = Extractor.extract(responseXml, [
    { key: 'destination', localPath: ['Response'], attributes: ['Destination'] },
    { key: 'issuer', localPath: ['Response', 'Issuer'], attributes: [] },
  ]);
  const issuers = [profile.issuer, ...(envelope['issuer'] == null ? [] : [envelope['issuer']].flat())];
  if (issuers.some((i) => i !== expected.idpEntityId)) {
    throw new SamlResponseRejected(
      'The sign-in response comes from an identity provider Seamline does not trust.',
      `Issuer is ${issuers.join(', ')}, expected ${expected.idpEntityId}`,
    );
  }
  if (envelope['destination'] !== expected.acsUrl) {
    throw new SamlResponseRejected(
      'The sign-in response was meant for another application.',
      `Destination is ${String(envelope['destination'])}, expected ${expected.acsUrl}`,
    );
  }
  // Two attributes make the extractor return one record per element (one attribute returns only the first).
  const { confirmations } = Extractor.extract(assertionXml, [
    { key: 'confirmations', localPath: CONFIRMATION_PATH, attributes: ['Recipient', 'NotOnOrAfter'] },
  ]);
  const records = [confirmations ?? []].flat() as Record<string, string | undefined>[];
  if (records.length === 0 || records.some((r) => r['recipient'] !== expected.acsUrl)) {
    const seen = records.map((r) => r['recipient'] ?? 'none').join(', ') || 'none';
    throw new SamlResponseRejected('The sign-in response was meant for another application.', `Recipient is ${seen}, expected ${expected.acsUrl}`);
  }
}

/** The sign-in claims in a validated profile: NameID (e-mail) plus the displayName, role and workspace attributes. */
export function claimsFromProfile(profile: Profile): SignInClaims {
  const attributes = (profile.attributes ?? {}) as Record<string, unknown>;
  const role = single(attributes['role'], 'role');
  if (!role) {
    throw new SamlResponseRejected('The identity provider sent no role for you.', 'role attribute missing');
  }
  return {
    email: profile.nameID,
    displayName: single(attributes['displayName'], 'displayName'),
    role,
    workspaceSlug: single(attributes['workspace'], 'workspace'),
  };
}

function single(value: unknown, name: string): string | undefined {
  if (value === undefined || value === null) return undefined;
  if (typeof value === 'string') return value;
  throw new SamlResponseRejected(`The identity provider sent an unusable “${name}” attribute.`, `${name} attribute is not a single string`);
}
