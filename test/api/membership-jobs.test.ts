import type { ScheduledJob } from '../../server/jobs/job-runner';
import { buildTestApp, fixedClock, type TestApp } from '../helpers/test-app';
import { signedIn, type Client, type TestUser } from '../helpers/users';
import { emailsTo, waitForEmails } from '../helpers/maildev';

// These tests use 2024-2025 dates, earlier than the other membership test files, so their daily jobs leave
// memberships created by those files (terms ending 2026 or later) as they are.
const clock = fixedClock('2024-06-03T17:00:00Z');
let t: TestApp;
let second: TestApp;
let adultPlan: number;

const job = (app: TestApp, name: string): ScheduledJob => app.app.jobs.find((j) => j.name === name)!;
const at = (date: string) => clock.set(`${date}T14:00:00Z`);

beforeAll(async () => {
  t = buildTestApp({ clock });
  second = buildTestApp({ clock });
  const res = await (await signedIn(t.app, t.deps.db)).client.get('/api/membership/plans');
  adultPlan = res.body.items.find((p: { code: string }) => p.code === 'adult').id;
});
afterAll(async () => {
  await t.close();
  await second.close();
});

async function member(
  opts: { autoRenew?: boolean; associationExpires?: string } = {},
): Promise<{ client: Client; user: TestUser }> {
  at('2024-06-03');
  const s = await signedIn(t.app, t.deps.db);
  const res = await s.client.post('/api/membership', {
    planId: adultPlan,
    profile: {
      legalName: 'Lorcan Pettibone',
      dateOfBirth: '1985-02-01',
      address: '3 Slough Lane, Gopher Flats, MB',
      phone: '204-555-0190',
      emergencyContact: 'Ines Pettibone 204-555-0191',
      associationNumber: 'NA-7781',
      associationExpires: opts.associationExpires ?? '2026-05-01',
      certificationLevel: 'L2',
    },
    waiverVersion: '2026-1',
    paymentToken: 'tok_visa',
    autoRenew: opts.autoRenew ?? false,
  });
  expect(res.status).toBe(201);
  expect(res.body.membership.termEnd).toBe('2024-12-31');
  return s;
}

const mails = (user: TestUser, template: string) =>
  t.deps.db('outbound_emails').where({ to_address: user.email, template });
const rolesOf = async (user: TestUser) =>
  (await t.deps.db('users').where('id', user.id).first('roles')).roles as string[];
const row = (user: TestUser) => t.deps.db('memberships').where('user_id', user.id).first();

describe('the reminder job', () => {
  it('sends each dues reminder once, on its day, even to a member who opted out of news', async () => {
    const { user } = await member();
    await t.deps.db('users').where('id', user.id).update({ marketing_opt_out: true });
    const reminders = job(t, 'membership-reminders');
    for (const [date, template] of [
      ['2024-12-01', 'membership-due-30'],
      ['2024-12-24', 'membership-due-7'],
      ['2024-12-31', 'membership-due-today'],
      ['2025-01-14', 'membership-overdue-14'],
    ] as const) {
      at(date);
      await reminders.run();
      await reminders.run();
      expect(await mails(user, template)).toHaveLength(1);
    }
    at('2024-11-30');
    expect(await mails(user, 'membership-due-30')).toHaveLength(1);
  });

  it('still sends once when two workers in two app instances run it at the same moment', async () => {
    const { user } = await member();
    at('2024-12-02');
    await Promise.all([
      job(t, 'membership-reminders').run(),
      job(second, 'membership-reminders').run(),
      job(t, 'membership-reminders').run(),
      job(second, 'membership-reminders').run(),
    ]);
    expect(await mails(user, 'membership-due-30')).toHaveLength(1);
  });

  it('reminds 30 days before the association membership expires, once', async () => {
    const { user } = await member({ associationExpires: '2024-09-30' });
    at('2024-08-31');
    await job(t, 'membership-reminders').run();
    await job(second, 'membership-reminders').run();
    const sent = await mails(user, 'membership-association-30');
    expect(sent).toHaveLength(1);
    expect(sent[0].subject).toContain('Sep 30, 2024');
  });

  it('moves status with the dates and takes the member role away once grace ends', async () => {
    const { user } = await member();
    expect(await rolesOf(user)).toContain('member');
    at('2025-01-15');
    await job(t, 'membership-reminders').run();
    expect((await row(user)).status).toBe('lapsing');
    expect(await rolesOf(user)).toContain('member');
    at('2025-01-31');
    await job(t, 'membership-reminders').run();
    expect((await row(user)).status).toBe('lapsed');
    expect(await rolesOf(user)).not.toContain('member');
    expect(await mails(user, 'membership-lapsed')).toHaveLength(1);
  });
});

describe('the auto-renew job', () => {
  it('charges the saved card on the last day of the term and sends the receipt', async () => {
    const { user, client } = await member({ autoRenew: true });
    at('2024-12-30');
    await job(t, 'membership-auto-renew').run();
    expect((await row(user)).renewal_attempts).toBe(0);
    at('2024-12-31');
    await Promise.all([job(t, 'membership-auto-renew').run(), job(second, 'membership-auto-renew').run()]);
    const me = await client.get('/api/membership/me');
    expect(me.body.membership).toEqual(
      expect.objectContaining({ termStart: '2025-01-01', termEnd: '2025-12-31', status: 'active' }),
    );
    expect(
      await t.deps.db('membership_payments').where({ membership_id: (await row(user)).id, status: 'paid' }),
    ).toHaveLength(2);
    await t.deps.mail.deliverDue();
    const receipts = (await waitForEmails(user.email, /Dues receipt/, 2)).map((m) => m.subject);
    expect(receipts).toContain(`Dues receipt: member ${me.body.membership.memberNumber}, paid to Dec 31, 2025`);
  });

  it('retries after a decline and renews when the next try succeeds', async () => {
    const { user, client } = await member({ autoRenew: true });
    expect(
      (await client.post('/api/membership/auto-renew', { autoRenew: true, paymentToken: 'tok_chargeCustomerFail' }))
        .status,
    ).toBe(200);
    at('2024-12-31');
    await job(t, 'membership-auto-renew').run();
    expect(await mails(user, 'membership-renewal-declined')).toHaveLength(1);
    expect((await row(user)).renewal_attempts).toBe(1);
    at('2025-01-02');
    await job(t, 'membership-auto-renew').run();
    expect((await row(user)).renewal_attempts).toBe(1);
    expect(
      (await client.post('/api/membership/auto-renew', { autoRenew: true, paymentToken: 'tok_visa' })).status,
    ).toBe(200);
    at('2025-01-03');
    await job(t, 'membership-auto-renew').run();
    const me = await client.get('/api/membership/me');
    expect(me.body.membership).toEqual(expect.objectContaining({ termEnd: '2025-12-31', status: 'active' }));
    expect(await rolesOf(user)).toContain('member');
  });

  it('lapses the membership with an e-mail after three declines over seven days', async () => {
    const { user, client } = await member({ autoRenew: true });
    await client.post('/api/membership/auto-renew', { autoRenew: true, paymentToken: 'tok_chargeCustomerFail' });
    for (const date of ['2024-12-31', '2025-01-03', '2025-01-07']) {
      at(date);
      await job(t, 'membership-auto-renew').run();
    }
    const m = await row(user);
    expect(m.status).toBe('lapsed');
    expect(m.renewal_failed_at).not.toBeNull();
    expect(await rolesOf(user)).not.toContain('member');
    expect(await mails(user, 'membership-renewal-declined')).toHaveLength(2);
    expect(await mails(user, 'membership-lapsed')).toHaveLength(1);
    expect(await t.deps.db('membership_payments').where({ membership_id: m.id, status: 'declined' })).toHaveLength(3);
    at('2025-01-20');
    await job(t, 'membership-auto-renew').run();
    expect(await t.deps.db('membership_payments').where({ membership_id: m.id, status: 'declined' })).toHaveLength(3);
    await t.deps.mail.deliverDue();
    expect((await emailsTo(user.email)).some((e) => e.subject === 'Your club membership has lapsed')).toBe(true);
  });
});
