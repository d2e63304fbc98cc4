import { CheckInTokens } from '../../server/membership/check-in-token';
import type { TestApp } from '../helpers/test-app';
import { signedIn, type Client, type TestUser } from '../helpers/users';

/** A signed-in member with a paid membership row (dues current until `termEnd`) and their card's token. */
export async function memberWithCard(
  t: TestApp,
  opts: { certificationLevel?: string; termEnd?: string; name?: string } = {},
): Promise<{ client: Client; user: TestUser; token: string; memberNumber: string }> {
  const s = await signedIn(t.app, t.deps.db, ['fan', 'member']);
  const plan = await t.deps.db('membership_plans').where('code', 'adult').first();
  const [m] = await t.deps
    .db('memberships')
    .insert({
      user_id: s.user.id,
      member_number: t.deps.db.raw("lpad(nextval('membership_number_seq')::text, 5, '0')"),
      plan_id: plan.id,
      status: 'active',
      term_start: '2030-01-01',
      term_end: opts.termEnd ?? '2099-12-31',
      legal_name: opts.name ?? 'Test Flyer',
      date_of_birth: '1985-04-04',
      address: '12 Prairie Road, Gopher Flats, MB',
      phone: '204-555-0100',
      emergency_contact: 'Neighbour 204-555-0101',
      certification_level: opts.certificationLevel ?? 'none',
      waiver_version: '2026-1',
      waiver_accepted_at: new Date(),
      safety_code_version: '2026-1',
      safety_code_accepted_at: new Date(),
    })
    .returning('member_number');
  const token = new CheckInTokens(t.config.sessionSecret).sign(m.member_number, new Date());
  return { ...s, token, memberNumber: m.member_number };
}

let counter = 0;

/** A launch body for POST /api/admin/launches. */
export function launchBody(date: string, over: Record<string, unknown> = {}) {
  counter++;
  return {
    title: `Test launch ${counter} ${Date.now().toString(36)}`,
    date,
    startsAt: '10:00',
    endsAt: '16:00',
    site: { name: 'Coulee Field', address: 'Range Road 12, Gopher Flats, MB', lat: 49.61, lon: -98.02 },
    ceilingMetres: 1500,
    notes: 'Bring water.',
    ...over,
  };
}

/** Creates a launch as range staff and answers its id. */
export async function createLaunch(rso: Client, date: string, over: Record<string, unknown> = {}): Promise<number> {
  const res = await rso.post('/api/admin/launches', launchBody(date, over));
  if (res.status !== 201) throw new Error(`launch not created: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.launch.id;
}
