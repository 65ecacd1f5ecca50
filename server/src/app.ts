/**
 * Builds the Express app: security headers, logs, sessions and sign-in, the
 * JSON API under /api/v1, the client (built files, or Vite in development),
 * and one error shape for everything.
 */
import express, { type Express } from 'express';
import helmet from 'helmet';
import type { Knex } from 'knex';
import type pino from 'pino';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { AppConfig } from './platform/config';
import { mountAuth } from './platform/auth';
import type { OidcEndpoints } from './platform/auth/discovery';
import { apiNotFound, errorHandler, unauthenticated } from './platform/errors';
import { requestLogger } from './platform/logging';
import { sessionRoutes } from './modules/session/routes';
import { adminRoutes } from './modules/admin/routes';
import { courseRoutes, termRoutes } from './modules/courses/routes';
import { healthRoutes } from './modules/health/routes';
import { reportRoutes } from './modules/reports/routes';
import { similarityRoutes } from './modules/similarity/routes';
import { jobRoutes } from './platform/jobs/routes';
import { templateRoutes } from './modules/templates/routes';
import { courseExerciseRoutes, exerciseRoutes } from './modules/exercises/routes';

export const clientDist = fileURLToPath(new URL('../../dist/client', import.meta.url));

export interface AppDeps {
  db: Knex;
  databaseUrl: string;
  config: AppConfig;
  oidc: OidcEndpoints;
  logger: pino.Logger;
  /** 'static' serves dist/client; 'vite' mounts Vite's dev middleware; 'none' serves no client. */
  client?: 'static' | 'vite' | 'none';
}

export interface BuiltApp {
  app: Express;
  close(): Promise<void>;
}

export async function createApp(deps: AppDeps): Promise<BuiltApp> {
  const app = express();
  app.disable('x-powered-by');
  if (deps.config.trustProxy) app.set('trust proxy', 1);
  const devClient = deps.client === 'vite';
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          // Vite's dev client needs inline scripts and a websocket; the built app needs neither.
          'script-src': devClient ? ["'self'", "'unsafe-inline'"] : ["'self'"],
          'connect-src': devClient ? ["'self'", 'ws:'] : ["'self'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'form-action': ["'self'", new URL(deps.oidc.issuer).origin],
          'upgrade-insecure-requests': deps.config.publicUrl.startsWith('https://') ? [] : null,
        },
      },
      hsts: deps.config.publicUrl.startsWith('https://'),
    }),
  );
  app.use(requestLogger(deps.logger));

  app.use('/api/health', healthRoutes(deps.db));

  const auth = mountAuth(app, deps);

  const api = express.Router();
  // Every state change on the API needs the CSRF token of the session.
  // No session: 401 before anything else is looked at.
  api.use((req, res, next) => {
    if (['GET', 'HEAD', 'OPTIONS'].includes(req.method)) return next();
    if (!req.user) return next(unauthenticated());
    auth.csrfProtection(req, res, next);
  });
  api.use(express.json({ limit: '1mb' }));
  api.use('/', sessionRoutes(deps.db, auth.generateCsrfToken));
  api.use('/admin', adminRoutes(deps.db));
  api.use('/courses', courseRoutes(deps.db));
  api.use('/', reportRoutes(deps.db), similarityRoutes(deps.db));
  api.use('/jobs', jobRoutes(deps.db));
  api.use('/', templateRoutes(deps.db));
  api.use('/terms', termRoutes(deps.db));
  api.use('/courses', courseExerciseRoutes(deps.db));
  api.use('/exercises', exerciseRoutes(deps.db));
  api.use(apiNotFound);
  app.use('/api/v1', api);
  app.use('/api', apiNotFound);
  app.use('/auth', apiNotFound);

  let closeVite: (() => Promise<void>) | undefined;
  if (deps.client === 'vite') {
    const { createServer } = await import('vite');
    const vite = await createServer({
      configFile: fileURLToPath(new URL('../../vite.config.ts', import.meta.url)),
      server: { middlewareMode: true },
      appType: 'spa',
    });
    app.use(vite.middlewares);
    closeVite = () => vite.close();
  } else if (deps.client !== 'none') {
    if (!existsSync(path.join(clientDist, 'index.html'))) {
      throw new Error(`The client is not built (${clientDist}/index.html is missing): run \`npm run build\`.`);
    }
    app.use(express.static(clientDist, { index: false, maxAge: '1h', immutable: false }));
    // Client-side routes: every other GET that accepts HTML gets the app shell.
    app.get(/^\/(?!api\/|auth\/).*/, (req, res, next) => {
      if (!req.accepts('html')) return next();
      res.sendFile(path.join(clientDist, 'index.html'));
    });
  }

  app.use(errorHandler);
  return {
    app,
    async close() {
      await auth.close();
      await closeVite?.();
    },
  };
}
