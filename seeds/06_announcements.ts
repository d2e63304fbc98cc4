import type { Knex } from 'knex';
import { CONSENT_WORDING } from '../server/announcements/consent-wording';
import { loadConfig } from '../server/config';

/** Invented people who asked for announcements, with the proof a real sign-up would leave. */
const SIGN_UPS = [
  { email: 'fan@padside.test', topics: ['launches', 'build-logs'], page: 'account' },
  { email: 'wren.tallgrass@padside.test', topics: ['drops'], page: 'home' },
  { email: 'osric.pembleton@padside.test', topics: ['drops', 'launches'], page: 'product' },
] as const;

export async function seed(knex: Knex): Promise<void> {
  // Already seeded: the first sign-up is there.
  if (
    await knex('subscriptions')
      .where({ email: SIGN_UPS[0].email, wording_version: CONSENT_WORDING.version })
      .first('id')
  )
    return;
  const team = loadConfig().site.teamName;
  const now = Date.now();
  for (const [i, s] of SIGN_UPS.entries()) {
    const requested = new Date(now - (40 - i * 10) * 86_400_000);
    const confirmed = new Date(requested.getTime() + 20 * 60_000);
    for (const topic of s.topics) {
      await knex('subscriptions').insert({
        email: s.email,
        topic,
        wording_version: CONSENT_WORDING.version,
        wording_text: CONSENT_WORDING.text(team),
        source_page: s.page,
        source_ip: '192.0.2.10',
        requested_at: requested,
        confirmed_at: confirmed,
        confirmed_ip: '192.0.2.10',
        confirmed_how: 'email-link',
      });
    }
  }
  const editor = await knex('users').where('email', 'editor@padside.test').first('id');
  await knex('announcements').insert({
    topic: 'launches',
    subject: 'Summer fly day: pads 5 and 6 open for high power',
    markdown:
      'The **summer fly day** has the high-power pads open this year.\n\n- certification cards checked at the range table\n- the range safety officer has the final word on every flight',
    created_by: editor?.id ?? null,
  });
}
