import type { Knex } from 'knex';

/** The SQL one Knex instance sends while `fn` runs, in order; tests count the reads and writes a path makes. */
export async function recordedQueries(db: Knex, fn: () => Promise<unknown>): Promise<string[]> {
  const seen: string[] = [];
  const log = (q: { sql: string }) => seen.push(q.sql);
  db.on('query', log);
  try {
    await fn();
  } finally {
    db.removeListener('query', log);
  }
  return seen;
}
