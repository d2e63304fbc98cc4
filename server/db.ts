import path from 'node:path';
import knex, { Knex } from 'knex';
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

/** Opens a connection pool; nothing connects until the first query. */
export function createDb(databaseUrl: string, poolMax = 10): Knex {
  return knex({
    client: 'pg',
    connection: databaseUrl,
    pool: { min: 0, max: poolMax },
    acquireConnectionTimeout: 5000,
    migrations: migrationConfig,
    seeds: seedConfig,
  });
}
