import compression from 'compression';
import express, { type Express } from 'express';
import helmet from 'helmet';
import morgan from 'morgan';
import { join } from 'node:path';
import type { Sequelize } from 'sequelize';
import { installAuth } from './auth';
import type { AuthConfig } from './auth/auth-config';
import type { AppConfig } from './config';
import { errorHandler, notFoundHandler } from './errors';
import { adminRouter } from './routes/admin.router';
import { authRouter } from './routes/auth.router';
import { devMailboxRouter } from './routes/dev-mailbox.router';
import { docsRouter } from './routes/docs.router';
import { healthRouter } from './routes/health.router';
import { labDataRouter } from './routes/lab-data.router';
import { libraryRouter } from './routes/library.router';
import { meRouter } from './routes/me.router';
import { compareRouter } from './routes/compare.router';
import { computeRouter } from './routes/compute.router';
import { designsRouter } from './routes/designs.router';

export interface AppDeps {
  readonly config: AppConfig;
  readonly sequelize: Sequelize;
  /** Sign-in settings to replace (tests: a provider on a random port, short timeouts, a small rate limit). */
  readonly auth?: Partial<AuthConfig>;
}

/** Builds the Express app; `main.ts` listens. Tests use the app without a port. */
export function createApp(deps: AppDeps): Express {
  const { config } = deps;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');

  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          // Angular Material and plotly add style elements at run time; scripts stay same-origin only.
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'", 'data:'],
          'worker-src': ["'self'", 'blob:'],
          'upgrade-insecure-requests': null,
        },
      },
      // Plain-http loopback deployments would otherwise be told to use https.
      strictTransportSecurity: config.publicUrl.startsWith('https:'),
    }),
  );
  app.use(compression());
  if (config.logRequests) app.use(morgan(':date[iso] :method :url :status :response-time ms'));
  app.use(express.json({ limit: '1mb' }));

  // Sessions, passport, res.locals.user and CSRF checks for /api and /auth; routers come after.
  const auth = installAuth(app, deps, deps.auth);
  app.use('/api/health', healthRouter(deps));
  app.use('/auth', authRouter(deps, auth));
  app.use('/api/me', meRouter(deps, auth));
  app.use('/api/admin', adminRouter(deps));
  app.use('/api/library', libraryRouter(deps));
  app.use('/api/lab-data', labDataRouter(deps));
  app.use('/api/dev/mailbox', devMailboxRouter(deps));
  app.use('/api/docs', docsRouter(deps));
  app.use('/api/compute', computeRouter(deps));
  app.use('/api', designsRouter(deps));
  app.use('/api', compareRouter(deps));

  app.use('/api', notFoundHandler);
  if (config.uiDir) {
    const uiDir = config.uiDir;
    app.use(express.static(uiDir, { index: false, maxAge: '1h' }));
    // Client-side routes: every other GET gets the app shell.
    app.get('/{*splat}', (_req, res) => {
      res.setHeader('Cache-Control', 'no-cache');
      res.sendFile(join(uiDir, 'index.html'));
    });
  }
  app.use(notFoundHandler);
  app.use(errorHandler);
  return app;
}
