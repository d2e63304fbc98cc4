import knex, { type Knex } from 'knex';
import { loadConfig } from '../../server/config';
import { migrationConfig } from '../../server/db';

export interface FreshDatabase {
  db: Knex;
  /** Its connection string, for an app of its own: `buildTestApp({ env: { DATABASE_URL: fresh.url } })`. */
  url: string;
  drop(): Promise<void>;
}

/**
 * A migrated database of its own beside the suite's shared one, for tests whose answer depends on every row of a
 * table (a demo seed, the last admin, an announcement's whole audience) while other suites change the shared one.
 */
export async function freshDatabase(sharedUrl = loadConfig().databaseUrl): Promise<FreshDatabase> {
  const name = `padside_fresh_${process.pid}_${Date.now()}`;
  const admin = knex({ client: 'pg', connection: sharedUrl, pool: { min: 0, max: 1 } });
  await admin.raw('CREATE DATABASE ??', [name]);
  const url = new URL(sharedUrl);
  url.pathname = `/${name}`;
  const db = knex({ client: 'pg', connection: url.toString(), pool: { min: 0, max: 4 } });
  await db.migrate.latest(migrationConfig);
  return {
    db,
    url: url.toString(),
    drop: async () => {
      await db.destroy();
      await admin.raw('DROP DATABASE IF EXISTS ?? WITH (FORCE)', [name]);
      await admin.destroy();
    },
  };
}
