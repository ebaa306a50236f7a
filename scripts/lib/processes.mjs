import { spawn } from 'node:child_process';
import * as fs from 'node:fs';
import * as net from 'node:net';
import * as readline from 'node:readline';

const COLOURS = { api: 35, worker: 33, idp: 32, mail: 34 };

/**
 * The child processes a script started, with their output shown line by line under their
 * name (pino's JSON lines are shortened to level, message and the fields that matter).
 */
export class ProcessGroup {
  #children = [];

  /**
   * Starts `node file` with extra environment; a child that dies on its own is reported.
   * With `logFile`, output goes to that file instead of the console.
   */
  start(name, file, env, { logFile } = {}) {
    const child = spawn(process.execPath, ['--enable-source-maps', file], {
      env: { ...process.env, ...env },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    const prefix = `\x1b[${COLOURS[name] ?? 37}m[${name}]\x1b[0m`;
    const log = logFile ? fs.createWriteStream(logFile, { flags: 'a' }) : null;
    for (const stream of [child.stdout, child.stderr]) {
      readline.createInterface({ input: stream }).on('line', (line) => {
        if (log) log.write(`${line}\n`);
        else console.log(`${prefix} ${formatLine(line)}`);
      });
    }
    child.on('exit', (code, signal) => {
      if (!child.stopping) console.error(`${prefix} exited unexpectedly (${signal ?? `code ${code}`})`);
      child.exited = true;
    });
    child.stopping = false;
    this.#children.push(child);
    return child;
  }

  /** Whether every started child is still alive. */
  allAlive() {
    return this.#children.every((c) => !c.exited);
  }

  /** SIGTERM to every child, SIGKILL after `graceMs`; resolves when all have exited. */
  async stopAll(graceMs = 12_000) {
    await Promise.all(
      this.#children.map(
        (child) =>
          new Promise((resolve) => {
            if (child.exited || child.exitCode !== null) return resolve();
            child.stopping = true;
            const timer = setTimeout(() => child.kill('SIGKILL'), graceMs);
            child.once('exit', () => {
              clearTimeout(timer);
              resolve();
            });
            child.kill('SIGTERM');
          }),
      ),
    );
  }
}

const LEVELS = { 10: 'trace', 20: 'debug', 30: 'info', 40: 'warn', 50: 'error', 60: 'fatal' };
const SKIP = new Set(['level', 'time', 'pid', 'hostname', 'name', 'process', 'msg', 'v']);

/** Shortens a pino JSON line to `level: message  field=value…`; other lines pass unchanged. */
export function formatLine(line) {
  if (!line.startsWith('{')) return line;
  try {
    const entry = JSON.parse(line);
    const extra = Object.entries(entry)
      .filter(([k]) => !SKIP.has(k))
      .map(([k, v]) => `${k}=${typeof v === 'object' ? JSON.stringify(v) : v}`)
      .join(' ');
    return `${LEVELS[entry.level] ?? entry.level}: ${entry.msg ?? ''}${extra ? `  ${extra}` : ''}`;
  } catch {
    return line;
  }
}

/** Resolves when `url` answers any HTTP status below 500; rejects after `timeoutMs`. */
export async function waitForHttp(url, timeoutMs = 30_000) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    try {
      const res = await fetch(url, { redirect: 'manual', signal: AbortSignal.timeout(2000) });
      if (res.status < 500) return;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) throw new Error(`${url} did not answer within ${timeoutMs / 1000} s`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

/** Resolves when a TCP connection to 127.0.0.1:port succeeds; rejects after `timeoutMs`. */
export async function waitForPort(port, timeoutMs = 30_000) {
  const deadline = Date.now() + timeoutMs;
  while (!(await canConnect(port))) {
    if (Date.now() > deadline) throw new Error(`nothing listened on 127.0.0.1:${port} within ${timeoutMs / 1000} s`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

function canConnect(port) {
  return new Promise((resolve) => {
    const socket = net.connect({ host: '127.0.0.1', port });
    socket.once('connect', () => {
      socket.destroy();
      resolve(true);
    });
    socket.once('error', () => resolve(false));
  });
}

/** Throws a clear error when something already listens on 127.0.0.1:port. */
export async function assertPortFree(port, what) {
  if (await canConnect(port)) {
    throw new Error(`127.0.0.1:${port} (${what}) is already in use — is another \`npm start\` running? Stop it or set the port variable.`);
  }
}

/** A port the OS says is free right now on 127.0.0.1. */
export function freePort() {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address();
      server.close(() => resolve(port));
    });
  });
}
