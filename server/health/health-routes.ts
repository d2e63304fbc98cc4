import { Router } from 'express';
import type { AppDeps } from '../deps';

function within<T>(ms: number, work: Promise<T>, fallback: T): Promise<T> {
  return Promise.race([work.catch(() => fallback), new Promise<T>((r) => setTimeout(() => r(fallback), ms).unref())]);
}

/** GET /api/health: 200 while the database answers, 503 when it does not; mail and payments are reported, not required. */
export function healthRoutes(deps: AppDeps): Router {
  const r = Router();
  r.get('/', async function health(_req, res) {
    const [db, mail, payments] = await Promise.all([
      within(
        2000,
        deps.db.raw('select 1').then(() => 'ok'),
        'down',
      ),
      within(
        2000,
        deps.mail.smtpReachable().then((up) => (up ? 'ok' : 'down')),
        'down',
      ),
      within(
        2000,
        deps.payments.reachable().then((up) => (up ? 'ok' : 'down')),
        'down',
      ),
    ]);
    res.status(db === 'ok' ? 200 : 503).json({ status: db === 'ok' ? 'ok' : 'degraded', db, mail, payments });
  });
  return r;
}
