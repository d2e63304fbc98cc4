import { loadConfig } from './config';
import { migrationConfig, seedConfig } from './db';

const config = loadConfig();

/** For the knex CLI (`npm run migrate`, `npm run seed`); the app itself migrates through `tasks/prepare-db`. */
module.exports = {
  client: 'pg',
  connection: config.databaseUrl,
  migrations: migrationConfig,
  seeds: seedConfig,
};
