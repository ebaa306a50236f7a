import type { Logger } from '../logger';

/**
 * Runs `close` once on SIGINT or SIGTERM, then exits. A second signal, or a close that hangs
 * for 10 s, exits at once so Ctrl-C never leaves a process behind.
 */
export function onShutdown(logger: Logger, close: () => Promise<void>): void {
  let closing = false;
  const stop = (signal: NodeJS.Signals) => {
    if (closing) process.exit(1);
    closing = true;
    logger.info({ signal }, 'shutting down');
    setTimeout(() => process.exit(1), 10_000).unref();
    close().then(
      () => process.exit(0),
      (err) => {
        logger.error({ err }, 'shutdown failed');
        process.exit(1);
      },
    );
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}
