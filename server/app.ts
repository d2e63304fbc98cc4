import { existsSync } from 'node:fs';
import path from 'node:path';
import express, { type Express } from 'express';
import pinoHttp from 'pino-http';
import { randomUUID } from 'node:crypto';
import { accountRoutes } from './account/account-routes';
import { userAdminRoutes } from './admin/user-admin-routes';
import { authRoutes } from './auth/auth-routes';
import { AuthService } from './auth/auth-service';
import { configurePassport } from './auth/passport-setup';
import { projectRoot } from './config';
import type { AppDeps } from './deps';
import { healthRoutes } from './health/health-routes';
import { csrfProtection } from './platform/csrf';
import { apiNotFound, errorHandler } from './platform/error-handler';
import { securityHeaders } from './platform/security-headers';
import { createSessionMiddleware } from './platform/session';

/** Paths that verify their own signature instead of a CSRF token. */
export const CSRF_EXEMPT = ['/api/payments/webhook'];

export const browserDist = path.join(projectRoot, 'dist', 'padside', 'browser');

/** Builds the Express app without listening; `close()` releases what the app itself opened. */
export function createApp(deps: AppDeps): Express & { close(): Promise<void> } {
  const app = express() as Express & { close(): Promise<void> };
  const auth = new AuthService(deps.db, deps.config.publicUrl, deps.clock);
  const passport = configurePassport(auth);
  const sessions = createSessionMiddleware(deps.config);

  app.disable('x-powered-by');
  app.set('trust proxy', deps.config.env === 'production' ? 1 : 'loopback');
  app.use(securityHeaders);
  app.use(pinoHttp({ logger: deps.log, genReqId: (req) => (req.headers['x-request-id'] as string) || randomUUID(), autoLogging: deps.config.env !== 'test' }));

  const api = express.Router();
  api.use(express.json({ limit: '100kb' }));
  api.use('/health', healthRoutes(deps));
  api.use(sessions.middleware);
  api.use(passport.initialize());
  api.use(passport.session());
  api.use(csrfProtection(CSRF_EXEMPT.map((p) => p.replace(/^\/api/, ''))));
  api.use('/auth', authRoutes(auth));
  api.use('/account', accountRoutes(auth));
  api.use('/admin/users', userAdminRoutes(auth.users));
  api.use(apiNotFound);
  app.use('/api', api);

  if (existsSync(browserDist)) {
    app.use(express.static(browserDist, { index: false, maxAge: '1h', setHeaders: (res, file) => /-[A-Z0-9]{8}\.(js|css)$/.test(file) && res.setHeader('Cache-Control', 'public, max-age=31536000, immutable') }));
    app.get(/^\/(?!api\/).*/, function spaFallback(_req, res) {
      res.sendFile(path.join(browserDist, 'index.html'));
    });
  }
  app.use(errorHandler);
  app.close = async () => {
    await sessions.pool.end();
  };
  return app;
}
