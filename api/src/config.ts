import * as path from 'node:path';
import { z } from 'zod';

/**
 * The one place where Seamline's server processes read their settings.
 * Every setting comes from an environment variable with a safe loopback default,
 * and the whole set is validated at start-up so a typo fails loudly and early.
 */

const port = z.coerce.number().int().min(1).max(65535);
const loopbackHost = z
  .string()
  .refine((h) => ['127.0.0.1', 'localhost', '::1'].includes(h) || process.env['SEAMLINE_ALLOW_PUBLIC_BIND'] === '1', {
    message: 'must be a loopback address (set SEAMLINE_ALLOW_PUBLIC_BIND=1 to bind elsewhere on purpose)',
  });

const schema = z.object({
  SEAMLINE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  SEAMLINE_HOST: loopbackHost.default('127.0.0.1'),
  SEAMLINE_API_PORT: port.default(4300),
  SEAMLINE_PUBLIC_URL: z.url().optional(),
  SEAMLINE_DATABASE_URL: z.string().regex(/^postgres(ql)?:\/\//, 'must be a postgres:// URL').default('postgres://seamline@127.0.0.1:54329/seamline'),
  SEAMLINE_DATA_DIR: z.string().min(1).default('.data'),
  SEAMLINE_WEB_DIST: z.string().min(1).default('dist/web/browser'),
  SEAMLINE_SESSION_SECRET: z.string().min(32, 'must be at least 32 characters').optional(),
  SEAMLINE_IDP_PORT: port.default(4310),
  SEAMLINE_IDP_URL: z.url().optional(),
  SEAMLINE_IDP_CERT_FILE: z.string().optional(),
  SEAMLINE_SMTP_HOST: loopbackHost.default('127.0.0.1'),
  SEAMLINE_SMTP_PORT: port.default(4325),
  SEAMLINE_MAIL_FROM: z.string().default('Seamline <seamline@otterbay.example>'),
  SEAMLINE_LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  SEAMLINE_DEMO_WORKSPACE: z.string().min(1).default('otterbay'),
  SEAMLINE_UPLOAD_MAX_MB: z.coerce.number().int().min(1).max(10_000).default(200),
  SEAMLINE_JOB_TIMEOUT_SECONDS: z.coerce.number().int().min(10).max(86_400).default(1800),
  SEAMLINE_JOB_MEMORY_MB: z.coerce.number().int().min(128).max(65_536).default(4096),
  SEAMLINE_JOB_RETRIES: z.coerce.number().int().min(0).max(10).default(2),
  SEAMLINE_JOB_STALE_SECONDS: z.coerce.number().int().min(5).max(3600).default(30),
  SEAMLINE_WORKER_CONCURRENCY: z.coerce.number().int().min(1).max(16).default(1),
  SEAMLINE_WORKER_NICE: z.coerce.number().int().min(0).max(19).default(10),
});

export interface Config {
  env: 'development' | 'test' | 'production';
  host: string;
  apiPort: number;
  /** Where browsers reach the API and the web app. */
  publicUrl: string;
  databaseUrl: string;
  dataDir: string;
  webDist: string;
  sessionSecret: string;
  saml: {
    /** SP entity ID; also the Audience the assertion must name. */
    spEntityId: string;
    /** Assertion consumer service URL; the response's Destination and Recipient. */
    callbackUrl: string;
    idpEntityId: string;
    /** Where the SP sends its AuthnRequest (HTTP-Redirect binding). */
    idpSsoUrl: string;
    idpCertFile: string;
  };
  idp: { port: number; url: string; keyDir: string };
  mail: { host: string; port: number; from: string; storeDir: string };
  logLevel: string;
  demoWorkspaceSlug: string;
  /** Uploaded zips and pushed snapshots wait here until a worker takes them. */
  inboxDir: string;
  /** Where workers extract uploads while they analyse them. */
  workDir: string;
  uploadMaxBytes: number;
  jobs: {
    /** A job running longer than this is stopped and fails with that reason. */
    timeoutSeconds: number;
    /** Heap limit of the thread that analyses a job. */
    memoryMb: number;
    /** Retries after a crash or a worker that stopped answering. */
    retries: number;
    /** A running job whose worker has not beaten its heart for this long is handed to another worker. */
    staleSeconds: number;
    /** Jobs one worker process runs at once. */
    concurrency: number;
    /** CPU priority (nice) of worker processes: analyses yield to the API's readers. */
    nice: number;
  };
}

/** Thrown when the environment does not describe a runnable server. */
export class ConfigError extends Error {
  constructor(readonly problems: string[]) {
    super(`Invalid Seamline configuration:\n  - ${problems.join('\n  - ')}`);
    this.name = 'ConfigError';
  }
}

/** Reads and validates the configuration from `env` (process.env by default). */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = schema.safeParse(env);
  if (!parsed.success) {
    throw new ConfigError(parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`));
  }
  const e = parsed.data;
  const dataDir = path.resolve(e.SEAMLINE_DATA_DIR);
  const publicUrl = stripSlash(e.SEAMLINE_PUBLIC_URL ?? `http://127.0.0.1:${e.SEAMLINE_API_PORT}`);
  const idpUrl = stripSlash(e.SEAMLINE_IDP_URL ?? `http://127.0.0.1:${e.SEAMLINE_IDP_PORT}`);
  const sessionSecret = e.SEAMLINE_SESSION_SECRET;
  if (!sessionSecret) {
    throw new ConfigError(['SEAMLINE_SESSION_SECRET: required (npm start generates one into the data folder)']);
  }
  const keyDir = path.join(dataDir, 'idp');
  return {
    env: e.SEAMLINE_ENV,
    host: e.SEAMLINE_HOST,
    apiPort: e.SEAMLINE_API_PORT,
    publicUrl,
    databaseUrl: e.SEAMLINE_DATABASE_URL,
    dataDir,
    webDist: path.resolve(e.SEAMLINE_WEB_DIST),
    sessionSecret,
    saml: {
      spEntityId: `${publicUrl}/api/auth/saml/metadata`,
      callbackUrl: `${publicUrl}/api/auth/saml/acs`,
      idpEntityId: `${idpUrl}/metadata`,
      idpSsoUrl: `${idpUrl}/sso`,
      idpCertFile: path.resolve(e.SEAMLINE_IDP_CERT_FILE ?? path.join(keyDir, 'idp-cert.pem')),
    },
    idp: { port: e.SEAMLINE_IDP_PORT, url: idpUrl, keyDir },
    mail: { host: e.SEAMLINE_SMTP_HOST, port: e.SEAMLINE_SMTP_PORT, from: e.SEAMLINE_MAIL_FROM, storeDir: path.join(dataDir, 'mail') },
    logLevel: e.SEAMLINE_LOG_LEVEL,
    demoWorkspaceSlug: e.SEAMLINE_DEMO_WORKSPACE,
    inboxDir: path.join(dataDir, 'inbox'),
    workDir: path.join(dataDir, 'work'),
    uploadMaxBytes: e.SEAMLINE_UPLOAD_MAX_MB * 1024 * 1024,
    jobs: {
      timeoutSeconds: e.SEAMLINE_JOB_TIMEOUT_SECONDS,
      memoryMb: e.SEAMLINE_JOB_MEMORY_MB,
      retries: e.SEAMLINE_JOB_RETRIES,
      staleSeconds: e.SEAMLINE_JOB_STALE_SECONDS,
      concurrency: e.SEAMLINE_WORKER_CONCURRENCY,
      nice: e.SEAMLINE_WORKER_NICE,
    },
  };
}

function stripSlash(url: string): string {
  return url.replace(/\/+$/, '');
}
