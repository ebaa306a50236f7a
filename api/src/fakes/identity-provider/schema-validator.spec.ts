import { validateSamlSchema } from './schema-validator';

const VALID =
  '<samlp:AuthnRequest xmlns:samlp="urn:oasis:names:tc:SAML:2.0:protocol" xmlns:saml="urn:oasis:names:tc:SAML:2.0:assertion" ' +
  'ID="_1" Version="2.0" IssueInstant="2026-01-01T00:00:00Z"><saml:Issuer>http://127.0.0.1/sp</saml:Issuer></samlp:AuthnRequest>';

describe('validateSamlSchema', () => {
  it('accepts schema-valid SAML and rejects the rest', async () => {
    await expect(validateSamlSchema(VALID)).resolves.toBeDefined();
    await expect(validateSamlSchema(VALID.replace('Version="2.0" ', ''))).rejects.toBeDefined();
  });

  it('leaves no "exit on drain" listener on stdout behind', async () => {
    const before = process.stdout.listenerCount('drain');
    for (let i = 0; i < 3; i++) await validateSamlSchema(VALID);
    expect(process.stdout.listenerCount('drain')).toBe(before);
  });
});
