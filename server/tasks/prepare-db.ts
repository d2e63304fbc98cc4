import { loadConfig, ConfigError } from '../config';
import { createDb } from '../db';

/**
 * Migrates the database; with --demo-seed, loads the demo data once (a marker row keeps restarts from re-seeding).
 * Refuses to seed in production.
 */
async function main(): Promise<void> {
  const config = loadConfig();
  const db = createDb(config.databaseUrl, 2);
  try {
    const [, applied] = await db.migrate.latest();
    if (applied.length) console.log(`padside: applied ${applied.length} migration(s)`);
    if (process.argv.includes('--demo-seed')) {
      if (config.env === 'production') throw new ConfigError('Padside: demo data is never loaded in production');
      const seeded = await db('app_meta').where('key', 'demo_seeded_at').first();
      if (!seeded) {
        await db.seed.run();
        await db('app_meta').insert({ key: 'demo_seeded_at', value: new Date().toISOString() });
        console.log('padside: demo data loaded');
      }
    }
  } finally {
    await db.destroy();
  }
}

main().catch((err) => {
  console.error(err instanceof ConfigError ? err.message : err);
  process.exit(1);
});
