import { spawn, spawnSync } from 'node:child_process';

/** Runs a command to completion with inherited output; throws with the command line on failure. */
export function run(cmd, args, options = {}) {
  const result = spawnSync(cmd, args, { stdio: 'inherit', ...options });
  if (result.error) throw new Error(`${cmd} could not start: ${result.error.message}`);
  if (result.status !== 0) throw new Error(`${[cmd, ...args].join(' ')} exited with ${result.status ?? result.signal}`);
  return result;
}

/** Runs a command and returns its stdout (trimmed); throws on failure. */
export function capture(cmd, args, options = {}) {
  const result = spawnSync(cmd, args, { encoding: 'utf8', ...options });
  if (result.error) throw new Error(`${cmd} could not start: ${result.error.message}`);
  if (result.status !== 0) {
    throw new Error(`${[cmd, ...args].join(' ')} exited with ${result.status}: ${(result.stderr || result.stdout || '').trim()}`);
  }
  return result.stdout.trim();
}

/** Runs a command asynchronously with inherited output; resolves with its exit code. */
export function runAsync(cmd, args, options = {}) {
  return new Promise((resolve, reject) => {
    const child = spawn(cmd, args, { stdio: 'inherit', ...options });
    child.on('error', reject);
    child.on('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0)));
  });
}
