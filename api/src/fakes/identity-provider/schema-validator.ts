import * as xmllint from '@authenio/samlify-node-xmllint';
import { quietly } from './quiet-console';

/**
 * samlify's schema validator (@authenio/samlify-node-xmllint), made safe for a long-running
 * process. Its emscripten xmllint "exits" after every run: it prints a blank line and registers
 * `process.stdout.once('drain', () => process.exit(status))`. Left alone, that piles up one
 * listener per validation and ends the whole process the next time stdout drains after
 * back-pressure. The run is synchronous, so for its duration those drain hooks are dropped and
 * console output is silenced; the verdict still arrives through the returned promise.
 */
export function validateSamlSchema(xml: string): Promise<unknown> {
  const stdout = process.stdout;
  const once = stdout.once;
  type Once = (this: typeof stdout, event: string | symbol, listener: (...args: unknown[]) => void) => typeof stdout;
  const dropDrain: Once = function (event, listener) {
    return event === 'drain' ? this : (once as Once).call(this, event, listener);
  };
  stdout.once = dropDrain as typeof stdout.once;
  try {
    return quietly(['log', 'error'], () => xmllint.validate(xml));
  } finally {
    stdout.once = once;
  }
}
