import express, { type Express } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import type { Pool } from 'pg';
import { pinoHttp } from 'pino-http';
import type { DataSource } from 'typeorm';
import { authRoutes } from './auth/auth.routes';
import { authenticate } from './auth/authenticate';
import { SessionStore } from './auth/session-store';
import type { Config } from './config';
import { auditRoutes } from './http/audit/audit.routes';
import { carvePlanRoutes } from './http/carve-plans/carve-plans.routes';
import { codebaseRoutes } from './http/codebases/codebases.routes';
import { docsRoutes } from './http/docs/docs.routes';
import { pushRoutes } from './http/push/push.routes';
import { shiftRoutes } from './http/shift/shift.routes';
import { snapshotRoutes } from './http/snapshots/snapshots.routes';
import { tokenRoutes } from './http/tokens/tokens.routes';
import { workspaceRoutes } from './http/workspace/workspace.routes';
import type { JobSender } from './jobs/job-queue';
import { CarvePlanService } from './services/carve-plans';
import { SnapshotCache } from './services/snapshot-cache';
import { apiNotFound, errorHandler } from './http/error-handler';
import { healthRoutes } from './http/health/health.routes';
import { meRoutes } from './http/me/me.routes';
import { outboxRoutes } from './http/outbox/outbox.routes';
import { SESSION_COOKIE } from './auth/saml-session';
import { staticWeb } from './http/static-web';
import type { Logger } from './logger';

/** What the HTTP app needs from the process that hosts it. */
export interface AppDeps {
  config: Config;
  dataSource: DataSource;
  /** Pool for the session table (kept apart from TypeORM's so sessions survive its restarts). */
  sessionPool: Pool;
  logger: Logger;
  /** Where uploads and pushes go to be analysed. */
  jobs: JobSender;
}

/** Routes whose body is a file streamed to disk or read as text by the route itself, never parsed as JSON here. */
const RAW_BODY = /^\/api\/(push|snapshots\/[^/]+\/coverage)(\?|$)/;

/** Builds the Express app without listening, so tests drive it with supertest. */
export function createApp(deps: AppDeps): Express {
  const { config, dataSource, logger } = deps;
  const app = express();
  const secure = config.publicUrl.startsWith('https://');
  if (secure) app.set('trust proxy', 1);
  app.disable('x-powered-by');

  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          // Angular Material sets inline styles at run time.
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'"],
          connectSrc: ["'self'"],
          workerSrc: ["'self'", 'blob:'],
          // The SAML request goes to the identity provider by redirect; nothing else leaves.
          formAction: ["'self'", config.idp.url],
          upgradeInsecureRequests: secure ? [] : null,
        },
      },
      crossOriginEmbedderPolicy: false,
    }),
  );
  app.use(
    pinoHttp({
      logger,
      autoLogging: { ignore: (req) => req.url === '/api/health' },
      // One short line per request: what was asked and how it ended, without headers.
      serializers: {
        req: (req: { method: string; url: string }) => ({ method: req.method, url: req.url }),
        res: (res: { statusCode: number }) => ({ status: res.statusCode }),
      },
    }),
  );

  app.use(
    session({
      name: SESSION_COOKIE,
      secret: config.sessionSecret,
      store: new SessionStore(deps.sessionPool),
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: { httpOnly: true, sameSite: 'lax', secure, maxAge: 8 * 60 * 60 * 1000 },
    }),
  );

  const api = express.Router();
  const cache = new SnapshotCache(dataSource);
  const plans = new CarvePlanService(dataSource, cache);
  api.use(express.json({ limit: '1mb', type: (req) => !RAW_BODY.test((req as express.Request).originalUrl ?? '') && /\bjson\b/.test(String(req.headers['content-type'] ?? '')) }));
  api.use(express.urlencoded({ extended: false, limit: '2mb' }));
  api.use('/health', healthRoutes(dataSource));
  api.use('/auth', authRoutes({ config, dataSource, logger }));
  api.use('/docs', docsRoutes());
  api.use(authenticate(dataSource));
  api.use('/me', meRoutes());
  api.use('/workspace', workspaceRoutes(dataSource));
  api.use('/tokens', tokenRoutes(dataSource));
  api.use('/audit-events', auditRoutes(dataSource));
  api.use('/codebases', codebaseRoutes({ dataSource, config, jobs: deps.jobs }));
  api.use('/push', pushRoutes({ dataSource, config, jobs: deps.jobs }));
  api.use('/snapshots', snapshotRoutes(dataSource, cache));
  api.use('/carve-plans', carvePlanRoutes(plans));
  api.use('/shift', shiftRoutes(dataSource, cache, plans));
  if (config.env !== 'production') api.use('/outbox', outboxRoutes(config.mail.storeDir));
  api.use(apiNotFound);
  app.use('/api', api);

  app.use(staticWeb(config.webDist));
  app.use(errorHandler(logger));
  return app;
}
