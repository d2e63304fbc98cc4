import connectPgSimple from 'connect-pg-simple';
import session, { type SessionData } from 'express-session';
import type { RequestHandler } from 'express';
import { Pool } from 'pg';
import type { Config } from '../config';

declare module 'express-session' {
  interface SessionData {
    /** When the store last wrote this session (ms), so an unchanged session is not rewritten on every request. */
    storedAt?: number;
  }
}

/** How often an unchanged session's expiry moves forward in the store (common practice, no source). */
export const SESSION_TOUCH_MS = 60 * 60_000;

/** Cookie session stored in PostgreSQL so any server process can serve any request. */
export function createSessionMiddleware(config: Config): { middleware: RequestHandler; pool: Pool } {
  const pool = new Pool({ connectionString: config.databaseUrl, max: 5 });
  // A dropped connection is reported per query; without this listener an idle-client error would end the process.
  pool.on('error', () => undefined);
  const PgStore = connectPgSimple(session);
  /**
   * express-session "touches" every session it loads and did not change (an UPDATE per request). Here the row is
   * written when the session changed, and otherwise at most once per SESSION_TOUCH_MS, so a session left alone for
   * its full 14 days ends at most that much early.
   */
  class ThriftyPgStore extends PgStore {
    override set(sid: string, sess: SessionData, callback?: (err?: unknown) => void): void {
      // A copy: the request's own session object keeps its hash, so express-session sees nothing new to save.
      super.set(sid, { ...sess, storedAt: Date.now() }, callback);
    }

    override touch(sid: string, sess: SessionData, callback?: () => void): void {
      if (Date.now() - (sess.storedAt ?? 0) < SESSION_TOUCH_MS) return callback?.();
      // express-session's callback takes the store's error, though the type says it takes none.
      this.set(sid, sess, callback as ((err?: unknown) => void) | undefined);
    }
  }
  const store = new ThriftyPgStore({
    pool,
    tableName: 'session',
    createTableIfMissing: false,
    pruneSessionInterval: config.env === 'test' ? false : 15 * 60,
  });
  const middleware = session({
    name: 'padside.sid',
    secret: config.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    proxy: config.env === 'production',
    // ASVS 4.0.3 3.4.1-3.4.3: Secure in production, HttpOnly, SameSite.
    cookie: { httpOnly: true, sameSite: 'lax', secure: config.env === 'production', maxAge: 14 * 24 * 3600_000 },
  });
  return { middleware, pool };
}
