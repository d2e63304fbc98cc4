import type { Knex } from 'knex';
import { hashPassword } from '../server/auth/password-hash';

/** Demo accounts of the invented Gopher Flats scenario; all share one password (README). Development only. */
export const DEMO_PASSWORD = 'padside-demo-2026';

export const DEMO_ACCOUNTS = [
  { email: 'admin@padside.test', name: 'Marisol Okafor-Lindqvist', roles: ['fan', 'admin'] },
  { email: 'treasurer@padside.test', name: 'Dale Brightwater', roles: ['fan', 'treasurer'] },
  { email: 'editor@padside.test', name: 'Juniper Achterberg', roles: ['fan', 'editor'] },
  { email: 'member@padside.test', name: 'Tomasz Redfeather', roles: ['fan', 'member'] },
  { email: 'fan@padside.test', name: 'Priya Vandersloot', roles: ['fan'] },
  { email: 'sponsor@padside.test', name: 'Cormac Ellingsen', roles: ['fan', 'sponsor'] },
] as const;

export async function seed(knex: Knex): Promise<void> {
  const hash = await hashPassword(DEMO_PASSWORD);
  for (const a of DEMO_ACCOUNTS) {
    await knex('users')
      .insert({
        email: a.email,
        password_hash: hash,
        display_name: a.name,
        roles: [...a.roles],
        email_verified_at: knex.fn.now(),
      })
      .onConflict('email')
      .ignore();
  }
}
