import path from 'node:path';
import knex, { Knex } from 'knex';
import pg from 'pg';
import type { Logger } from 'pino';
import { projectRoot } from './config';

/** Where migrations and seeds live, source or compiled. */
const compiled = __dirname.includes(`${path.sep}dist${path.sep}`);
const codeRoot = compiled ? path.join(projectRoot, 'dist') : projectRoot;

export const migrationConfig: Knex.MigratorConfig = {
  directory: path.join(codeRoot, 'migrations'),
  loadExtensions: compiled ? ['.js'] : ['.ts'],
  tableName: 'knex_migrations',
};

export const seedConfig: Knex.SeederConfig = {
  directory: path.join(codeRoot, 'seeds'),
  loadExtensions: compiled ? ['.js'] : ['.ts'],
};

const INT8 = 20;
const DATE = 1082;

/**
 * Every id is a `bigIncrements` column and every `count(*)` an int8, which node-postgres hands over as text by default.
 * Read them as numbers, so each value has one shape from the database on. Ids and cent sums stay far below 2^53; one
 * that does not is a fault to report, not a string to pass along as a second shape.
 */
export function parseInt8(text: string): number {
  const n = Number(text);
  if (!Number.isSafeInteger(n))
    throw new RangeError(`int8 value ${text} is beyond what a JavaScript number holds exactly`);
  return n;
}

/**
 * Type parsers for Padside's connections, set on each connection (not on node-postgres' global table) so other pools
 * in the same process keep the defaults.
 * - int8 (20): a number, see {@link parseInt8}.
 * - date (1082): the `YYYY-MM-DD` text PostgreSQL sends. A Date at local midnight shifts the day in other time zones.
 * - numeric (1700) stays text: it holds exact decimals (tax rates, site coordinates, thrust-to-weight) that must not
 *   pass through a float. Sums of bigint columns are numeric too, so such queries cast the sum back to `::bigint`.
 * - timestamptz stays a Date.
 */
export const pgTypes: Knex.PgCustomTypesConfig = {
  getTypeParser: (oid: number, format: string) => {
    if (format === 'binary') return pg.types.getTypeParser(oid, 'binary');
    if (oid === INT8) return parseInt8;
    if (oid === DATE) return (text: string) => text;
    return pg.types.getTypeParser(oid, 'text');
  },
};

/** Knex connection settings for a database URL, with Padside's type parsers. */
export function pgConnection(databaseUrl: string): Knex.PgConnectionConfig {
  return { connectionString: databaseUrl, types: pgTypes };
}

/** Opens a connection pool; nothing connects until the first query. Knex's own warnings go to our logger. */
export function createDb(databaseUrl: string, poolMax = 10, log?: Logger): Knex {
  return knex({
    ...(log
      ? {
          log: {
            warn: (m: unknown) => log.warn({ knex: m }),
            error: (m: unknown) => log.error({ knex: m }),
            deprecate: (m: unknown) => log.warn({ knex: m }),
            debug: () => undefined,
          },
        }
      : {}),
    client: 'pg',
    connection: pgConnection(databaseUrl),
    pool: { min: 0, max: poolMax },
    acquireConnectionTimeout: 5000,
    migrations: migrationConfig,
    seeds: seedConfig,
  });
}
