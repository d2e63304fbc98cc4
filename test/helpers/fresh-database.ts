import knex, { type Knex } from 'knex';
import { loadConfig } from '../../server/config';
import { migrationConfig, pgConnection } from '../../server/db';

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
  const db = knex({ client: 'pg', connection: pgConnection(url.toString()), pool: { min: 0, max: 4 } });
  await db.migrate.latest(migrationConfig);
  // The payment fake is shared by the whole run, and its idempotency keys carry row ids ("padside-order-1-attempt-1"):
  // ids that start again at 1 would replay another suite's charge. Every id sequence starts far from the shared ones.
  const start = 1_000_000_000 + Math.floor(Math.random() * 500_000) * 1_000;
  const sequences = await db.raw<{ rows: { name: string }[] }>(
    "SELECT sequence_name AS name FROM information_schema.sequences WHERE sequence_schema = 'public' AND sequence_name LIKE '%\\_id\\_seq'",
  );
  for (const { name } of sequences.rows) await db.raw('SELECT setval(?::regclass, ?)', [`"${name}"`, start]);
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
