import { access, readFile } from 'node:fs/promises';
import { AppError } from '../errors';

/** The identity provider cannot be used yet: its signing certificate is not where the config says. */
export class IdentityProviderUnavailableError extends AppError {
  constructor(certFile: string) {
    super(
      503,
      'idp_unavailable',
      `The identity provider's certificate was not found at ${certFile}; start the identity-provider fake or set SEAMLINE_IDP_CERT_FILE.`,
    );
  }
}

/** Fails with `IdentityProviderUnavailableError` unless the certificate file is readable. */
export async function assertIdpCertPresent(certFile: string): Promise<void> {
  try {
    await access(certFile);
  } catch {
    throw new IdentityProviderUnavailableError(certFile);
  }
}

/**
 * Reads the IdP's signing certificate at the moment it is needed, not at start-up: the API may
 * start before the identity-provider fake has generated its keys, and a regenerated key pair
 * takes effect without restarting the API.
 */
export async function readIdpCert(certFile: string): Promise<string> {
  let pem: string;
  try {
    pem = await readFile(certFile, 'utf8');
  } catch {
    throw new IdentityProviderUnavailableError(certFile);
  }
  if (!pem.includes('-----BEGIN CERTIFICATE-----')) {
    throw new AppError(503, 'idp_unavailable', `The file ${certFile} does not hold a PEM certificate for the identity provider.`);
  }
  return pem;
}
