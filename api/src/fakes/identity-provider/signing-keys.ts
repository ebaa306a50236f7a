import { randomUUID } from 'node:crypto';
import { chmod, mkdir, readFile, rename, writeFile } from 'node:fs/promises';
import * as path from 'node:path';
import { generate } from 'selfsigned';

/** The identity-provider fake's signing key and its self-signed certificate, both PEM. */
export interface SigningKeys {
  privateKey: string;
  cert: string;
}

/** The private key's file name in the key folder (mode 600). */
export const KEY_FILE = 'idp-key.pem';
/** The certificate's file name in the key folder; the API reads it from here by default. */
export const CERT_FILE = 'idp-cert.pem';

/**
 * Reuses the key pair in `dir` when both files exist, otherwise generates a fresh RSA-2048 key
 * with a ten-year self-signed certificate and writes it there (the key readable by its owner only).
 */
export async function ensureSigningKeys(dir: string): Promise<SigningKeys> {
  const existing = await readSigningKeys(dir);
  if (existing) return existing;
  const now = new Date();
  const generated = await generate([{ name: 'commonName', value: 'Seamline identity-provider fake' }], {
    keySize: 2048,
    algorithm: 'sha256',
    notBeforeDate: new Date(now.getTime() - 60_000),
    notAfterDate: new Date(now.getTime() + 10 * 365 * 24 * 3600_000),
  });
  const keys = { privateKey: generated.private, cert: generated.cert };
  await mkdir(dir, { recursive: true, mode: 0o700 });
  // Key first, certificate last and both by rename: a reader that finds the certificate finds a whole pair.
  await writeAtomically(path.join(dir, KEY_FILE), keys.privateKey, 0o600);
  await writeAtomically(path.join(dir, CERT_FILE), keys.cert, 0o644);
  return keys;
}

async function readSigningKeys(dir: string): Promise<SigningKeys | null> {
  try {
    const [privateKey, cert] = await Promise.all([
      readFile(path.join(dir, KEY_FILE), 'utf8'),
      readFile(path.join(dir, CERT_FILE), 'utf8'),
    ]);
    return { privateKey, cert };
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code === 'ENOENT') return null;
    throw err;
  }
}

async function writeAtomically(file: string, text: string, mode: number): Promise<void> {
  const temp = `${file}.${randomUUID()}.tmp`;
  await writeFile(temp, text, { mode });
  await chmod(temp, mode);
  await rename(temp, file);
}
