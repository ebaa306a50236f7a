import connectPgSimple from 'connect-pg-simple';
import express, { type Express } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import type { Pool } from 'pg';
import { pinoHttp } from 'pino-http';
import type { DataSource } from 'typeorm';
import { authRoutes } from './auth/auth.routes';
import { requireSession } from './auth/require-session';
import type { Config } from './config';
import { codebaseRoutes } from './http/codebases/codebases.routes';
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
}

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

  const PgStore = connectPgSimple(session);
  app.use(
    session({
      name: SESSION_COOKIE,
      secret: config.sessionSecret,
      store: new PgStore({ pool: deps.sessionPool, tableName: 'http_session', createTableIfMissing: false }),
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: { httpOnly: true, sameSite: 'lax', secure, maxAge: 8 * 60 * 60 * 1000 },
    }),
  );

  const api = express.Router();
  api.use(express.json({ limit: '1mb' }));
  api.use(express.urlencoded({ extended: false, limit: '2mb' }));
  api.use('/health', healthRoutes(dataSource));
  api.use('/auth', authRoutes({ config, dataSource, logger }));
  api.use(requireSession(dataSource));
  api.use('/me', meRoutes());
  api.use('/codebases', codebaseRoutes(dataSource));
  if (config.env !== 'production') api.use('/outbox', outboxRoutes(config.mail.storeDir));
  api.use(apiNotFound);
  app.use('/api', api);

  app.use(staticWeb(config.webDist));
  app.use(errorHandler(logger));
  return app;
}
