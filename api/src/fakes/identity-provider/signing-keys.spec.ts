import { createPrivateKey, X509Certificate } from 'node:crypto';
import { mkdtemp, rm, stat } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import * as path from 'node:path';
import { CERT_FILE, ensureSigningKeys, KEY_FILE } from './signing-keys';

describe('ensureSigningKeys', () => {
  let dir: string;
  beforeAll(async () => {
    dir = path.join(await mkdtemp(path.join(tmpdir(), 'seamline-keys-')), 'idp');
  });
  afterAll(() => rm(path.dirname(dir), { recursive: true, force: true }));

  it('generates a matching key and certificate, the key readable by its owner only, then reuses them', async () => {
    const first = await ensureSigningKeys(dir);
    const cert = new X509Certificate(first.cert);
    expect(cert.checkPrivateKey(createPrivateKey(first.privateKey))).toBe(true);
    expect(new Date(cert.validTo).getTime()).toBeGreaterThan(Date.now() + 365 * 24 * 3600_000);
    expect((await stat(path.join(dir, KEY_FILE))).mode & 0o777).toBe(0o600);
    expect((await stat(path.join(dir, CERT_FILE))).isFile()).toBe(true);

    const second = await ensureSigningKeys(dir);
    expect(second).toEqual(first);
  });
});
