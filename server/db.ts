import path from 'node:path';
import knex, { Knex } from 'knex';
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
    connection: databaseUrl,
    pool: { min: 0, max: poolMax },
    acquireConnectionTimeout: 5000,
    migrations: migrationConfig,
    seeds: seedConfig,
  });
}
