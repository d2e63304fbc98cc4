import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type { RequestHandler } from 'express';
import { Pool } from 'pg';
import type { Config } from '../config';

/** Cookie session stored in PostgreSQL so any server process can serve any request. */
export function createSessionMiddleware(config: Config): { middleware: RequestHandler; pool: Pool } {
  const pool = new Pool({ connectionString: config.databaseUrl, max: 5 });
  // A dropped connection is reported per query; without this listener an idle-client error would end the process.
  pool.on('error', () => undefined);
  const PgStore = connectPgSimple(session);
  const store = new PgStore({ pool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: config.env === 'test' ? false : 15 * 60 });
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
