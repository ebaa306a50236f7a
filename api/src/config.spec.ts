import * as path from 'node:path';
import { ConfigError, loadConfig } from './config';

const secret = { SEAMLINE_SESSION_SECRET: 'x'.repeat(32) };

describe('loadConfig', () => {
  it('should default to loopback addresses and the documented ports', () => {
    const config = loadConfig(secret);
    expect(config.host).toBe('127.0.0.1');
    expect(config.publicUrl).toBe('http://127.0.0.1:4300');
    expect(config.saml.callbackUrl).toBe('http://127.0.0.1:4300/api/auth/saml/acs');
    expect(config.saml.idpSsoUrl).toBe('http://127.0.0.1:4310/sso');
    expect(config.mail).toMatchObject({ host: '127.0.0.1', port: 4325 });
    expect(config.dataDir).toBe(path.resolve('.data'));
  });

  it('should run analyses at a lower CPU priority unless told otherwise, within the range nice allows', () => {
    expect(loadConfig(secret).jobs.nice).toBe(10);
    expect(loadConfig({ ...secret, SEAMLINE_WORKER_NICE: '0' }).jobs.nice).toBe(0);
    expect(() => loadConfig({ ...secret, SEAMLINE_WORKER_NICE: '20' })).toThrow(/SEAMLINE_WORKER_NICE/);
  });

  it('should derive the SAML URLs from the public URL', () => {
    const config = loadConfig({ ...secret, SEAMLINE_PUBLIC_URL: 'https://seamline.otterbay.example/' });
    expect(config.saml.spEntityId).toBe('https://seamline.otterbay.example/api/auth/saml/metadata');
  });

  it('should list every problem at once', () => {
    let error: unknown;
    try {
      loadConfig({ ...secret, SEAMLINE_API_PORT: 'eighty', SEAMLINE_DATABASE_URL: 'mysql://x', SEAMLINE_ENV: 'staging' });
    } catch (err) {
      error = err;
    }
    expect(error).toBeInstanceOf(ConfigError);
    const problems = (error as ConfigError).problems.join('\n');
    expect(problems).toMatch(/SEAMLINE_API_PORT/);
    expect(problems).toMatch(/SEAMLINE_DATABASE_URL: must be a postgres:\/\/ URL/);
    expect(problems).toMatch(/SEAMLINE_ENV/);
  });

  it('should refuse to bind to a non-loopback address by accident', () => {
    expect(() => loadConfig({ ...secret, SEAMLINE_HOST: '0.0.0.0' })).toThrow(/loopback/);
  });

  it('should require a session secret of useful length', () => {
    expect(() => loadConfig({})).toThrow(/SEAMLINE_SESSION_SECRET/);
    expect(() => loadConfig({ SEAMLINE_SESSION_SECRET: 'short' })).toThrow(/at least 32/);
  });
});
