import { loadConfig } from '../../config';
import { createLogger } from '../../logger';
import { onShutdown } from '../../process/shutdown';
import { createMailFake } from './mail-fake';
import { MailStore } from './mail-store';

/** Mail fake process: SMTP on loopback; messages land in the data folder's mail/. */
function main(): void {
  const config = loadConfig();
  const logger = createLogger('mail-fake', config.logLevel);
  const server = createMailFake(new MailStore(config.mail.storeDir), (err) => logger.error({ err }, 'smtp error'));
  server.listen(config.mail.port, config.mail.host, () => {
    logger.info({ smtp: `${config.mail.host}:${config.mail.port}`, store: config.mail.storeDir }, 'mail fake listening');
  });
  onShutdown(logger, () => new Promise<void>((resolve) => server.close(() => resolve())));
}

main();
