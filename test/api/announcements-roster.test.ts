import request from 'supertest';
import { buildTestApp, fixedClock, type TestApp } from '../helpers/test-app';
import { signedIn, type Client, type TestUser } from '../helpers/users';
import { oneClickUrl } from './announcement-fixtures';

// 2032 dates keep these memberships clear of the other membership files' daily jobs.
const clock = fixedClock('2032-03-10T17:00:00Z');
let t: TestApp;
let treasurer: Client;
let adultPlan: number;
const tag = `R${Date.now().toString(36)}`;

beforeAll(async () => {
  t = buildTestApp({ clock });
  treasurer = (await signedIn(t.app, t.deps.db, ['fan', 'treasurer'])).client;
  const res = await treasurer.get('/api/membership/plans');
  adultPlan = res.body.items.find((p: { code: string }) => p.code === 'adult').id;
});
afterAll(() => t.close());
beforeEach(() => clock.set('2032-03-10T17:00:00Z'));

async function member(name: string): Promise<{ user: TestUser; id: number }> {
  const s = await signedIn(t.app, t.deps.db);
  const res = await s.client.post('/api/membership', {
    planId: adultPlan,
    profile: {
      legalName: `${name} ${tag}`,
      dateOfBirth: '1981-04-04',
      address: '9 Gopher Lane, Gopher Flats, MB',
      phone: '204-555-0190',
      emergencyContact: 'Kin 204-555-0191',
      certificationLevel: 'none',
    },
    waiverVersion: '2026-1',
    paymentToken: 'tok_visa',
  });
  expect(res.status).toBe(201);
  return { user: s.user, id: Number((await t.deps.db('memberships').where('user_id', s.user.id).first()).id) };
}

const mailTo = (email: string, template: string) =>
  t.deps.db('outbound_emails').where({ to_address: email, template }).orderBy('id');
const email = (body: object) => treasurer.post('/api/admin/members/email', { filters: { q: tag }, ...body });

describe('POST /api/admin/members/email', () => {
  it('sends news as commercial mail under the consent rules, and club business as transactional mail to everyone', async () => {
    const keen = await member('Keen');
    const quiet = await member('Quiet');
    const gone = await member('Gone');
    await t.deps.db('users').where('id', quiet.user.id).update({ marketing_opt_out: true });
    // Left the club more than two years ago: implied consent has lapsed (from memory: CASL, two years).
    await t.deps.db('memberships').where('id', gone.id).update({ term_end: '2030-03-09' });

    const news = await email({ subject: 'Swap meet', text: 'Bring spare fins.' });
    expect(news.status).toBe(200);
    expect(news.body).toEqual({ queued: 1, skippedOptedOut: 1, skippedLapsedConsent: 1, skippedSuppressed: 0 });
    const [sent] = await mailTo(keen.user.email, 'membership-roster-news');
    expect(sent.category).toBe('commercial');
    expect(sent.list).toBe('club-news');
    expect(sent.headers['List-Unsubscribe-Post']).toBe('List-Unsubscribe=One-Click');
    expect(sent.text_body).toMatch(/You get this because you are or were a member of /);
    expect(sent.text_body).toMatch(/Gopher Flats, MB R0A 0A0/);

    // One click stops club news for that address; the next news mail leaves it out.
    const url = new URL(oneClickUrl(sent));
    expect(
      (
        await request(t.app)
          .post(url.pathname + url.search)
          .type('form')
          .send('List-Unsubscribe=One-Click')
      ).status,
    ).toBe(200);
    expect((await email({ subject: 'Swap meet, again', text: 'Still on.' })).body).toEqual({
      queued: 0,
      skippedOptedOut: 1,
      skippedLapsedConsent: 1,
      skippedSuppressed: 1,
    });

    // Club business reaches all three, without list headers, and says why it came.
    const business = await email({ subject: 'Dues reminder', text: 'Renewals open.', purpose: 'club-business' });
    expect(business.body.queued).toBe(3);
    for (const m of [keen, quiet, gone]) {
      const [row] = await mailTo(m.user.email, 'membership-roster-business');
      expect(row.category).toBe('transactional');
      expect(row.headers).toBeNull();
      expect(row.text_body).toMatch(/it is club business/);
    }
  });

  it('counts a membership that ended two years ago tomorrow as still consenting, and not on the day itself', async () => {
    const edge = await member('Edge');
    await t.deps.db('memberships').where('id', edge.id).update({ term_end: '2030-03-11' });
    expect((await email({ subject: 'Edge day before', text: 'x' })).body.queued).toBe(1);
    await t.deps.db('memberships').where('id', edge.id).update({ term_end: '2030-03-10' });
    expect((await email({ subject: 'Edge on the day', text: 'x' })).body.queued).toBe(0);
  });

  it('answers 400 for an unknown purpose', async () => {
    const res = await email({ subject: 'x', text: 'y', purpose: 'spam' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.purpose).toBeDefined();
  });
});
