import { randomUUID } from 'node:crypto';
import { Constants, SamlLib, type IdentityProviderInstance, type ServiceProviderInstance } from 'samlify';

/** How long a response may be presented at the ACS; short, because it is posted at once. */
export const RESPONSE_LIFETIME_MS = 2 * 60_000;

/** What one login response asserts. */
export interface LoginResponseInput {
  /** ID of the AuthnRequest being answered (the response's InResponseTo). */
  requestId: string;
  /** The person who signed in; `role` is a plain string so tests can send roles Seamline does not know. */
  person: { email: string; displayName: string; role: string };
  workspaceSlug: string;
  /** Issue time; defaults to now. A time in the past yields an expired response. */
  now?: Date;
}

/** A finished login response: its ID and the XML (raw or base64, as the caller says). */
export interface RenderedResponse {
  id: string;
  context: string;
}

/**
 * Builds and signs (response and assertion) a login response for the HTTP-POST binding.
 * The base64 `context` is the SAMLResponse form value.
 */
export async function createSignedLoginResponse(
  idp: IdentityProviderInstance,
  sp: ServiceProviderInstance,
  input: LoginResponseInput,
  relayState?: string,
): Promise<RenderedResponse & { relayState?: string; entityEndpoint: string }> {
  const tags = tagValues(idp, sp, input);
  const requestInfo = { extract: { request: { id: input.requestId } } };
  // samlify only fills attribute tags through customTagReplacement, which must then fill every tag.
  const result = await idp.createLoginResponse(sp, requestInfo, 'post', { email: input.person.email }, {
    relayState,
    customTagReplacement: (template) => ({ id: tags['ID']!, context: SamlLib.replaceTagsByValue(template, tags) }),
  });
  if (!('entityEndpoint' in result)) throw new Error('samlify returned no POST binding context');
  return { id: result.id, context: result.context, relayState: result.relayState, entityEndpoint: result.entityEndpoint };
}

/** The same response as raw XML, unsigned (tests use it to show that unsigned responses are refused). */
export function renderUnsignedLoginResponse(
  idp: IdentityProviderInstance,
  sp: ServiceProviderInstance,
  input: LoginResponseInput,
): RenderedResponse {
  const template = idp.entitySetting.loginResponseTemplate?.context;
  if (!template) throw new Error('the identity provider has no login response template');
  const tags = tagValues(idp, sp, input);
  return { id: tags['ID']!, context: SamlLib.replaceTagsByValue(template, tags) };
}

function tagValues(idp: IdentityProviderInstance, sp: ServiceProviderInstance, input: LoginResponseInput): Record<string, string> {
  const now = input.now ?? new Date();
  const until = new Date(now.getTime() + RESPONSE_LIFETIME_MS).toISOString();
  const acs = [sp.entityMeta.getAssertionConsumerService('post')].flat()[0];
  if (!acs) throw new Error('the service provider has no HTTP-POST assertion consumer service');
  return {
    ID: `_${randomUUID()}`,
    AssertionID: `_${randomUUID()}`,
    IssueInstant: now.toISOString(),
    Issuer: idp.entityMeta.getEntityID(),
    Destination: acs,
    SubjectRecipient: acs,
    Audience: sp.entityMeta.getEntityID(),
    InResponseTo: input.requestId,
    StatusCode: Constants.StatusCode.Success,
    ConditionsNotBefore: now.toISOString(),
    ConditionsNotOnOrAfter: until,
    SubjectConfirmationDataNotOnOrAfter: until,
    NameIDFormat: Constants.namespace.format.emailAddress,
    NameID: input.person.email,
    attrEmail: input.person.email,
    attrName: input.person.displayName,
    attrRole: input.person.role,
    attrWorkspace: input.workspaceSlug,
  };
}
