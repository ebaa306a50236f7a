import type { Server } from 'node:http';
import { loadConfig } from '../../config';
import { createLogger } from '../../logger';
import { onShutdown } from '../../process/shutdown';
import { createIdentityProviderApp } from './identity-provider.app';
import { ensureSigningKeys } from './signing-keys';

/** Identity-provider fake process: generates its signing keys on first start, then serves SAML sign-in. */
async function main(): Promise<void> {
  const config = loadConfig();
  const logger = createLogger('identity-provider', config.logLevel);
  const keys = await ensureSigningKeys(config.idp.keyDir);
  const app = createIdentityProviderApp(config, keys, logger);
  const server: Server = app.listen(config.idp.port, config.host, () => {
    logger.info({ url: config.idp.url, certFile: config.saml.idpCertFile, keyDir: config.idp.keyDir }, 'identity-provider fake listening');
  });
  server.on('error', (err) => {
    logger.fatal({ err }, `identity-provider fake could not listen on ${config.host}:${config.idp.port}`);
    process.exit(1);
  });
  onShutdown(logger, async () => {
    await new Promise<void>((resolve) => server.close(() => resolve()));
  });
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
