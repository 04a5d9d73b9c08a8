import path from 'node:path';
import fs from 'node:fs';
import express, { type Express } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import { rateLimit } from 'express-rate-limit';
import type { Sequelize } from 'sequelize';
import type { AppConfig } from './config';
import { loadUser, renewSessions, requireUser } from './middleware/auth';
import { requireCsrf } from './middleware/csrf';
import { apiNotFound, errorHandler } from './middleware/error-handler';
import { createAuthRouter } from './routes/auth';
import { createCalcRouter } from './routes/calc';
import { createHealthRouter } from './routes/health';
import { createSetupsRouter } from './routes/setups';
import { createBatchesRouter } from './routes/batches';
import { createInventoriesRouter } from './routes/inventories';
import { createStorage } from './services/storage/create-storage';
import type { ObjectStorage } from './services/storage/object-storage';
import { S3Storage } from './services/storage/s3-storage';
import { openApiDocument } from './openapi';
import { LoginThrottle } from './services/login-throttle';
import './session-types';
import { createAccessRouter } from './routes/access';
import { createTeamAdminRouter } from './routes/team-admin';
import { createTeamExportRouter } from './routes/team-export';
import { createTrainingRouter } from './routes/training';
import { configureMail } from './services/mailer';
import { createSessionStore } from './services/session-store';

/** Name of the session cookie (not the library's default). */
export const SESSION_COOKIE = 'slantwise.sid';

export interface AppDeps {
  readonly config: AppConfig;
  readonly sequelize: Sequelize;
}

export interface SlantwiseApp {
  readonly app: Express;
  /** Where uploads are kept (the upload sweep works on the same storage). */
  readonly storage: ObjectStorage;
  /** Stops background timers (the session store's expiry sweep) and closes the storage client. */
  close(): void;
}

/** Builds the Express app: API under /api, the built Angular app everywhere else. */
export function createApp({ config, sequelize }: AppDeps): SlantwiseApp {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.trustProxy);
  app.set('query parser', 'simple');

  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'default-src': ["'self'"],
          'script-src': ["'self'"],
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'", 'data:'],
          'connect-src': ["'self'"],
          'object-src': ["'none'"],
          'frame-ancestors': ["'none'"],
          'base-uri': ["'self'"],
          'form-action': ["'self'"],
        },
      },
      crossOriginEmbedderPolicy: false,
    }),
  );

  const sessions = createSessionStore(sequelize, config.sessionIdleMs);
  const store = sessions.store;

  app.use('/api', express.json({ limit: '100kb' }));
  app.use('/api/health', createHealthRouter(sequelize));
  app.get('/api/openapi.json', (_req, res) => {
    res.json(openApiDocument);
  });

  app.use(
    '/api/calc',
    rateLimit({
      windowMs: 60_000,
      limit: config.calcRateLimitPerMinute,
      // draft-7 headers (RateLimit, RateLimit-Policy): draft-8's adds a SHA-256 of the client's key to
      // every answer. The library's configuration checks only log, on every request; this
      // configuration is fixed and tested (`trust proxy` is set deliberately from TRUST_PROXY), so
      // they are off.
      standardHeaders: 'draft-7',
      legacyHeaders: false,
      validate: false,
      handler: (_req, res) => {
        res.status(429).json({ error: 'Too many calculation requests from this address; wait a minute and try again.' });
      },
    }),
    createCalcRouter(),
  );

  app.use(
    '/api',
    session({
      name: SESSION_COOKIE,
      secret: config.sessionSecret,
      store,
      resave: false,
      saveUninitialized: false,
      // Not on every response: renewSessions below renews the expiry (cookie and row) once a minute.
      rolling: false,
      proxy: config.trustProxy !== false ? true : undefined,
      cookie: { httpOnly: true, sameSite: 'lax', secure: config.secureCookies ? true : 'auto', maxAge: config.sessionIdleMs, path: '/' },
    }),
  );

  app.use('/api', renewSessions(Math.min(60_000, config.sessionIdleMs / 10)));
  app.use('/api', requireCsrf(['/calc/']), loadUser(sessions));
  app.use('/api/auth', createAuthRouter(new LoginThrottle({ limit: 8, windowMs: 10 * 60_000 })));
  const storage = createStorage(config.uploads);
  app.use('/api/setups', requireUser, createSetupsRouter({ sequelize, storage, config }));
  app.use('/api/inventories', requireUser, createInventoriesRouter(sequelize));
  app.use('/api/batches', requireUser, createBatchesRouter(sequelize));
  configureMail(config);
  app.use('/api/access', createAccessRouter(new LoginThrottle({ limit: 5, windowMs: 15 * 60_000 })));
  app.use('/api/team', requireUser, createTeamAdminRouter(config));
  app.use('/api/team', requireUser, createTeamExportRouter({ sequelize, storage }));
  app.use('/api/training', requireUser, createTrainingRouter());
  app.use('/api', apiNotFound);

  if (config.staticDir && fs.existsSync(config.staticDir)) {
    const root = path.resolve(config.staticDir);
    app.use(express.static(root, { index: false, maxAge: '1h', setHeaders: (res, file) => {
      if (file.endsWith('index.html')) res.setHeader('Cache-Control', 'no-cache');
    } }));
    app.get('/{*path}', (_req, res) => {
      res.setHeader('Cache-Control', 'no-cache');
      res.sendFile(path.join(root, 'index.html'));
    });
  }

  app.use(errorHandler);

  return {
    app,
    storage,
    close: () => {
      sessions.stop();
      if (storage instanceof S3Storage) storage.close();
    },
  };
}
