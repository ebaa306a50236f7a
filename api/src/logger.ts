import pino from 'pino';

/** Structured JSON logs on stdout; one logger per process, named after it. */
export function createLogger(name: string, level: string): pino.Logger {
  return pino({
    name,
    level,
    base: { process: name },
    redact: { paths: ['req.headers.cookie', 'req.headers.authorization', 'res.headers["set-cookie"]'], remove: true },
  });
}

export type Logger = pino.Logger;
