import 'reflect-metadata';
import '../shared/schemas/messages'; // plain sentences for schema checks, before any schema runs
import { existsSync } from 'node:fs';
import path from 'node:path';
import express, { type Express } from 'express';
import helmet from 'helmet';
import type { Queue } from 'bullmq';
import type { Redis } from 'ioredis';
import type pg from 'pg';
import { requireCsrfToken } from './auth/csrf';
import { config } from './config';
import { passport } from './auth/passport';
import { sessionMiddleware } from './auth/session';
import { checkBodyShape } from './http/body-shape';
import { serveClient } from './http/clientAssets';
import { errorHandler, notFoundApi } from './http/errors';
import { smallJsonBody } from './http/json-body';
import type { Mailer } from './mail/mailer';
import { apiRouters } from './routes';

export interface AppDeps {
  redis: Redis;
  pgPool: pg.Pool;
  /** Producer side of the job queue. */
  queue: Queue;
  mailer: Mailer;
  /** Folder of the built client; served with a fallback to index.html when present. */
  clientDir?: string;
}

/** The whole HTTP app, without listening: tests drive it with supertest. */
export function createApp({ redis, pgPool, queue, mailer, clientDir = path.resolve('dist') }: AppDeps): Express {
  const app = express();
  app.disable('x-powered-by');
  // Behind a TLS-terminating proxy: req.secure (Secure session cookie) and req.ip (sign-in limits) come from X-Forwarded-*.
  app.set('trust proxy', config.trustProxy);
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          // Plotly sets inline styles; the preview solver runs in a Web Worker from a blob in dev builds
          // and compiles the march kernel (WebAssembly, shipped in the bundle) there.
          'script-src': ["'self'", "'wasm-unsafe-eval'"],
          'style-src': ["'self'", "'unsafe-inline'"],
          'worker-src': ["'self'", 'blob:'],
          'img-src': ["'self'", 'data:', 'blob:'],
          'upgrade-insecure-requests': null,
        },
      },
      // HSTS only where the site is served over HTTPS; not for subdomains, which Timefield does not own.
      strictTransportSecurity: config.cookieSecure ? { maxAge: 365 * 24 * 60 * 60, includeSubDomains: false } : false,
    }),
  );
  app.use(smallJsonBody);
  app.use(sessionMiddleware(pgPool));
  app.use(passport.session());

  const api = express.Router();
  api.use(requireCsrfToken);
  api.use(checkBodyShape);
  api.use(...apiRouters(redis, queue, mailer));
  api.use(notFoundApi);
  app.use('/api', api);

  if (existsSync(path.join(clientDir, 'index.html'))) {
    serveClient(app, clientDir);
  }
  app.use(errorHandler);
  return app;
}
