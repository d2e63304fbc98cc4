import { randomUUID } from 'node:crypto';
import { existsSync } from 'node:fs';
import compression from 'compression';
import express, { type Express, type Router } from 'express';
import pinoHttp from 'pino-http';
import { ONE_CLICK_PATH } from './announcements/announcement-routes';
import { AuthService } from './auth/auth-service';
import { configurePassport } from './auth/passport-setup';
import type { AppDeps } from './deps';
import { buildFeatures } from './features';
import { healthRoutes } from './health/health-routes';
import { siteRoutes } from './site/site-routes';
import type { ScheduledJob } from './jobs/job-runner';
import { csrfProtection } from './platform/csrf';
import { DatabaseNotifications } from './platform/database-notifications';
import { rotateSessionOnRoleChange } from './platform/session-rotation';
import { apiNotFound, errorHandler } from './platform/error-handler';
import type { Mount, Platform } from './feature';
import { cspNonce, hstsOverHttps, noStore, permissionsPolicy, securityHeaders } from './platform/security-headers';
import { refuseUnstorableText } from './platform/text-guard';
import { createSessionMiddleware } from './platform/session';
import { PageRenderer } from './ssr/page-renderer';
import { pageRoutes } from './ssr/page-routes';
import { SettingsService } from './settings/settings-service';
import { ImageUploads } from './uploads/image-uploads';
import { storageFromConfig } from './uploads/storage-from-config';

/**
 * Paths under /api that verify their own signature instead of a CSRF token: the payment webhook, and the one-click
 * unsubscribe (RFC 8058: a mail client POSTs a form to the signed link, with no session).
 */
export const CSRF_EXEMPT = ['/payments/webhook', ONE_CLICK_PATH];

const HASHED_ASSET = /-[A-Z0-9]{8}\.(js|css|woff2?|ttf)$/;

/** A recorded mount: `prefix` is the full path prefix ('/api/auth'). */
export interface MountRecord {
  prefix: string;
  router: Router;
}

export type PadsideApp = Express & {
  close(): Promise<void>;
  jobs: ScheduledJob[];
  platform: Platform;
  mounts: MountRecord[];
};

/** Builds the Express app without listening; `close()` releases what the app itself opened. */
export function createApp(deps: AppDeps): PadsideApp {
  const app = express() as PadsideApp;
  const auth = new AuthService(deps.db, deps.config.publicUrl, deps.clock, deps.log);
  const storage = storageFromConfig(deps.config.storage);
  const notifications = new DatabaseNotifications(deps.config.databaseUrl, deps.log);
  const platform: Platform = {
    deps,
    auth,
    settings: new SettingsService(deps.db, notifications),
    // The features answer what still shows an image; they exist by the time anyone deletes one.
    images: new ImageUploads(deps.db, storage, async (urls) =>
      (await Promise.all(features.map((f) => f.imageUses?.(urls) ?? []))).flat(),
    ),
    notifications,
  };
  const features = buildFeatures(platform);
  const passport = configurePassport(auth);
  const sessions = createSessionMiddleware(deps.config);

  app.disable('x-powered-by');
  app.set('trust proxy', deps.config.env === 'production' ? 1 : 'loopback');
  app.use(cspNonce);
  app.use(securityHeaders({ stripeJs: deps.config.stripe.publishableKey !== null }));
  app.use(permissionsPolicy);
  app.use(hstsOverHttps);
  app.use(
    pinoHttp({
      logger: deps.log,
      genReqId: (req) => (req.headers['x-request-id'] as string) || randomUUID(),
      autoLogging: deps.config.env !== 'test',
      // One short line per request; headers (cookies, CSRF tokens) stay out of the log.
      serializers: {
        req: (req) => ({ id: req.id, method: req.method, url: req.url }),
        res: (res) => ({ status: res.statusCode }),
      },
    }),
  );

  const mounts: MountRecord[] = [];
  const api = express.Router();
  const apiMount: Mount = (at, router) => {
    mounts.push({ prefix: '/api' + at, router });
    api.use(at, router);
  };
  // The webhook needs its raw body for the signature check, so JSON parsing skips it.
  api.use((req, res, next) =>
    CSRF_EXEMPT.includes(req.path) ? next() : express.json({ limit: '100kb' })(req, res, next),
  );
  apiMount('/health', healthRoutes(deps));
  apiMount('/site', siteRoutes(deps.config.site, deps.config.clubTimeZone));
  // Public reads: no session, so their answers say themselves how they may be cached. The text guard runs here too.
  for (const feature of features)
    feature.mountPublic?.((at, router) => {
      mounts.push({ prefix: '/api' + at, router });
      api.use(at, refuseUnstorableText, router);
    });
  // Everything from here on may depend on who is signed in, CSV and PDF downloads included.
  api.use(noStore);
  api.use(sessions.middleware);
  api.use(passport.initialize());
  api.use(passport.session());
  api.use(rotateSessionOnRoleChange);
  api.use(csrfProtection(CSRF_EXEMPT));
  api.use(refuseUnstorableText);
  for (const feature of features) feature.mount(apiMount);
  api.use(apiNotFound);
  app.use('/api', api);
  const siteMount: Mount = (at, router) => {
    mounts.push({ prefix: at, router });
    app.use(at, router);
  };
  for (const feature of features) feature.mountSite?.(siteMount);

  const browserDist = deps.config.browserDist;
  const renderer = existsSync(browserDist) ? PageRenderer.forBuild(browserDist, deps.config.publicUrl) : null;
  if (existsSync(browserDist)) {
    // Only the app's own files are compressed: API answers carry the CSRF token beside text a user typed (BREACH).
    app.use(compression());
    // The build names its scripts, styles and fonts after their content, so those never change under one name.
    app.use(
      express.static(browserDist, {
        index: false,
        maxAge: '1h',
        setHeaders: (res, file) =>
          HASHED_ASSET.test(file) && res.setHeader('Cache-Control', 'public, max-age=31536000, immutable'),
      }),
    );
    // Public pages are rendered on the server (as a visitor), personal ones get the client-rendered shell.
    app.get(/^\/(?!api\/|uploads\/).*/, pageRoutes(renderer, browserDist, deps.config.publicUrl));
  }
  app.use(errorHandler);
  app.jobs = [
    { name: 'mail-sweep', cron: '*/5 * * * *', run: () => deps.mail.deliverDue() },
    ...features.flatMap((f) => f.jobs ?? []),
  ];
  app.platform = platform;
  app.mounts = mounts;
  app.close = async () => {
    await auth.afterAnswer.settled();
    await sessions.pool.end();
    await platform.notifications.close();
    storage.close?.();
    await renderer?.close();
  };
  return app;
}
