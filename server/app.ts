import { existsSync } from 'node:fs';
import path from 'node:path';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import type { Logger } from 'pino';
import type { Config } from './config.ts';
import type { Database } from './db/client.ts';
import { RouteRegistry } from './lib/http.ts';
import { apiNotFound, errorHandler } from './middleware/error-handler.ts';
import { originCheck } from './middleware/origin-check.ts';
import { authenticate } from './modules/auth/auth.middleware.ts';
import { authRoutes } from './modules/auth/auth.routes.ts';
import { createAuthService } from './modules/auth/auth.service.ts';
import { createSessionStore } from './modules/auth/session.ts';
import { membersRoutes } from './modules/departments/members.routes.ts';
import { createMembersService } from './modules/departments/members.service.ts';
import { healthRoutes } from './modules/health/health.routes.ts';

export interface AppDeps {
  config: Config;
  database: Database;
  logger: Logger;
}

/** Wires every module into one Express app. The only place where things are put together. */
export function createApp({ config, database, logger }: AppDeps): Express {
  const { db } = database;
  const registry = new RouteRegistry();
  const sessions = createSessionStore(db, config.SESSION_DAYS);
  const auth = createAuthService(db, sessions);
  const members = createMembersService(db);

  const app = express();
  app.locals.registry = registry;
  app.disable('x-powered-by');
  app.set('trust proxy', config.TRUST_PROXY);
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          'script-src': ["'self'"],
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'connect-src': ["'self'"],
          'upgrade-insecure-requests': config.PUBLIC_URL?.startsWith('https:') ? [] : null,
        },
      },
      strictTransportSecurity: config.PUBLIC_URL?.startsWith('https:') ?? false,
    }),
  );
  app.use(pinoHttp({ logger, autoLogging: { ignore: (req) => req.url === '/api/health' } }));

  app.use('/api', express.json({ limit: config.JSON_BODY_LIMIT }));
  app.use('/api', originCheck());
  app.use('/api', authenticate(db, sessions));

  app.use('/api', healthRoutes(registry, db));
  app.use('/api', authRoutes(registry, config, auth, sessions));
  app.use('/api/members', membersRoutes(registry, members));
  app.use('/api', apiNotFound);

  const clientDir = path.resolve(config.CLIENT_DIST);
  if (existsSync(path.join(clientDir, 'index.html'))) {
    app.use(express.static(clientDir, { index: false, maxAge: '1h' }));
    // Every non-API path is a client route: answer with the app shell.
    app.get('/{*splat}', (_req, res) => res.sendFile(path.join(clientDir, 'index.html')));
  }

  app.use(errorHandler(logger));
  return app;
}
