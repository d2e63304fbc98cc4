import type Stripe from 'stripe';
import request from 'supertest';
import { serve } from '../helpers/browser';
import { buildTestApp, fixedClock, type TestApp } from '../helpers/test-app';
import { createUser } from '../helpers/users';

// Two app instances, each with its own pool, like two server processes on one database and one processor.
const clock = fixedClock('2026-06-15T17:00:00Z');
let a: TestApp;
let b: TestApp;
let sites: { baseUrl: string; stop(): Promise<void> }[];
let adultPlan: number;

beforeAll(async () => {
  a = buildTestApp({ clock });
  b = buildTestApp({ clock });
  sites = [await serve(a), await serve(b)];
  adultPlan = (await request(sites[0].baseUrl).get('/api/membership/plans')).body.items.find(
    (p: { code: string }) => p.code === 'adult',
  ).id;
});
afterAll(async () => {
  for (const s of sites) await s.stop();
  await a.close();
  await b.close();
});
beforeEach(() => clock.set('2026-06-15T17:00:00Z'));

const cookieOf = (res: request.Response) =>
  ((res.headers['set-cookie'] as unknown as string[] | undefined) ?? []).map((c) => c.split(';')[0]).join('; ');

/** A signed-in session (the cookie and its CSRF token) that either process accepts. */
async function session() {
  const user = await createUser(a.deps.db);
  const site = sites[0].baseUrl;
  const first = await request(site).get('/api/auth/csrf');
  const login = await request(site)
    .post('/api/auth/login')
    .set('Cookie', cookieOf(first))
    .set('X-CSRF-Token', first.body.csrfToken)
    .send({ email: user.email, password: user.password });
  expect(login.status).toBe(200);
  let cookie = cookieOf(login);
  const csrf = (await request(site).get('/api/auth/csrf').set('Cookie', cookie)).body.csrfToken as string;
  // Like a browser, follow the new session id the server hands out when the member role arrives.
  const follow = (res: request.Response) => {
    cookie = cookieOf(res) || cookie;
    return res;
  };
  /** GET and POST through process `i % 2`. */
  const get = async (path: string, i = 0) =>
    follow(
      await request(sites[i % 2].baseUrl)
        .get(path)
        .set('Cookie', cookie),
    );
  const post = async (path: string, body: object, i = 0) =>
    follow(
      await request(sites[i % 2].baseUrl)
        .post(path)
        .set('Cookie', cookie)
        .set('X-CSRF-Token', csrf)
        .send(body),
    );
  return { user, get, post };
}

const joinBody = (over: Record<string, unknown> = {}) => ({
  planId: adultPlan,
  profile: {
    legalName: 'Wilhelmina Quarrie',
    dateOfBirth: '1988-09-30',
    address: '7 Launch Rail Road, Gopher Flats, MB',
    phone: '204-555-0177',
    emergencyContact: 'Tobiah Quarrie 204-555-0178',
    certificationLevel: 'L1',
  },
  waiverVersion: '2026-1',
  paymentToken: 'tok_visa',
  ...over,
});

/** A member whose term ends 2026-12-31; renewals on 2026-11-20 buy 2027-01-01 to 2027-12-31. */
async function member(autoRenew: boolean) {
  const s = await session();
  const joined = await s.post('/api/membership', joinBody({ autoRenew }));
  expect([joined.status, joined.body.error]).toEqual([201, undefined]);
  expect(joined.body.membership.termEnd).toBe('2026-12-31');
  expect((await s.get('/api/membership/me')).status).toBe(200);
  clock.set('2026-11-20T17:00:00Z');
  const row = await a.deps.db('memberships').where('user_id', s.user.id).first();
  return { ...s, row, memberNumber: joined.body.membership.memberNumber as string };
}

/** Every charge the payment fake holds for a member, read from the processor rather than from our own rows. */
async function chargesAtProcessor(memberNumber: string): Promise<Stripe.Charge[]> {
  const found: Stripe.Charge[] = [];
  for await (const c of a.processor.charges.list({ limit: 100 })) {
    if (c.metadata?.memberNumber === memberNumber) found.push(c);
  }
  return found;
}

const succeededFor = async (memberNumber: string, termEnd: string) =>
  (await chargesAtProcessor(memberNumber)).filter(
    (c) => c.status === 'succeeded' && c.description?.endsWith(`to ${termEnd}, member ${memberNumber}`),
  );

const fire = (n: number, send: (i: number) => Promise<request.Response>) =>
  Promise.all(Array.from({ length: n }, (_, i) => send(i)));

describe('POST /api/membership/renew', () => {
  describe('when five renewals with the saved card arrive at once on two processes', () => {
    it('charges the card once and extends the term once', async () => {
      const m = await member(true);
      const answers = await fire(5, (i) => m.post('/api/membership/renew', {}, i));
      expect(answers.map((r) => r.status).filter((s) => s !== 200 && s !== 409)).toEqual([]);
      expect(answers.some((r) => r.status === 200)).toBe(true);
      // A click still sharing the first charge hears it is in progress; one that waited behind the finished renewal hears it is done.
      for (const r of answers.filter((x) => x.status === 409))
        expect(['renewal_in_progress', 'already_renewed']).toContain(r.body.error.code);
      expect(await succeededFor(m.memberNumber, '2027-12-31')).toHaveLength(1);
      expect(await succeededFor(m.memberNumber, '2028-12-31')).toEqual([]);
      const after = await a.deps.db('memberships').where('id', m.row.id).first();
      expect(after.term_end).toBe('2027-12-31');
      expect(await a.deps.db('membership_payments').where({ membership_id: m.row.id, status: 'paid' })).toHaveLength(2);
    });
  });

  describe('when the member clicks renew again after the renewal went through', () => {
    it('answers 409 already_renewed and charges nothing for the term after', async () => {
      const m = await member(true);
      expect((await m.post('/api/membership/renew', {})).status).toBe(200);
      const again = await m.post('/api/membership/renew', { paymentToken: 'tok_mastercard' }, 1);
      expect([again.status, again.body.error?.code]).toEqual([409, 'already_renewed']);
      expect(again.body.error.message).toContain('2027-01-01');
      expect(await succeededFor(m.memberNumber, '2028-12-31')).toEqual([]);
      const me = await m.get('/api/membership/me');
      expect(me.body.membership).toEqual(
        expect.objectContaining({ termEnd: '2027-12-31', renewalOpensOn: '2027-01-01', renewalOpen: false }),
      );
    });
  });

  describe('when five renewals with different new cards arrive at once (two tabs, several submits)', () => {
    it('charges one card once', async () => {
      const m = await member(false);
      const tokens = ['tok_visa', 'tok_mastercard', 'tok_ca', 'tok_amex', 'tok_visa_debit'];
      const answers = await fire(5, (i) => m.post('/api/membership/renew', { paymentToken: tokens[i] }, i));
      expect(answers.map((r) => r.status).filter((s) => s !== 200 && s !== 409)).toEqual([]);
      expect(answers.some((r) => r.status === 200)).toBe(true);
      expect(await succeededFor(m.memberNumber, '2027-12-31')).toHaveLength(1);
      expect((await a.deps.db('memberships').where('id', m.row.id).first()).term_end).toBe('2027-12-31');
    });
  });

  describe('when the saved card is declined', () => {
    it('tries the card again on the next click, and renews once a good card is on file', async () => {
      const m = await member(true);
      expect(
        (await m.post('/api/membership/auto-renew', { autoRenew: true, paymentToken: 'tok_chargeCustomerFail' }))
          .status,
      ).toBe(200);
      const first = await m.post('/api/membership/renew', {});
      expect(first.status).toBe(402);
      expect(first.body.error.code).toBe('payment_declined');
      const second = await m.post('/api/membership/renew', {}, 1);
      expect(second.status).toBe(402);
      // Each click after a recorded decline is a new attempt at the processor, not the replay of the first answer.
      expect(
        await a.deps.db('membership_payments').where({ membership_id: m.row.id, status: 'declined' }),
      ).toHaveLength(2);
      expect((await chargesAtProcessor(m.memberNumber)).filter((c) => c.status === 'failed')).toHaveLength(2);
      expect((await m.post('/api/membership/auto-renew', { autoRenew: true, paymentToken: 'tok_visa' })).status).toBe(
        200,
      );
      const ok = await m.post('/api/membership/renew', {});
      expect(ok.status).toBe(200);
      expect(ok.body.membership).toEqual(expect.objectContaining({ termEnd: '2027-12-31', status: 'active' }));
      expect(await succeededFor(m.memberNumber, '2027-12-31')).toHaveLength(1);
    });

    it('renews with a new card entered instead', async () => {
      const m = await member(true);
      await m.post('/api/membership/auto-renew', { autoRenew: true, paymentToken: 'tok_chargeCustomerFail' });
      expect((await m.post('/api/membership/renew', {})).status).toBe(402);
      const ok = await m.post('/api/membership/renew', { paymentToken: 'tok_mastercard' });
      expect(ok.status).toBe(200);
      expect(ok.body.membership.termEnd).toBe('2027-12-31');
      expect(await succeededFor(m.memberNumber, '2027-12-31')).toHaveLength(1);
    });
  });

  describe('when an earlier attempt for the term is still with the processor', () => {
    const attempt = (membershipId: string, attemptedAt: string, key: string) =>
      a.deps.db('membership_payments').insert({
        membership_id: membershipId,
        plan_id: adultPlan,
        status: 'attempted',
        method: 'card',
        amount_cents: 4500,
        idempotency_key: key,
        term_start: '2027-01-01',
        term_end: '2027-12-31',
        attempted_at: attemptedAt,
        created_at: attemptedAt,
      });

    it('answers 409 while it is recent, without charging', async () => {
      const m = await member(true);
      await attempt(m.row.id, '2026-11-20T16:59:30Z', `card:${m.row.id}:2027-12-31:in-flight`);
      const res = await m.post('/api/membership/renew', {});
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('renewal_in_progress');
      expect(await succeededFor(m.memberNumber, '2027-12-31')).toHaveLength(0);
    });

    it('no longer holds the term once its process is long gone', async () => {
      const m = await member(true);
      await attempt(m.row.id, '2026-11-20T16:40:00Z', `card:${m.row.id}:2027-12-31:crashed`);
      const res = await m.post('/api/membership/renew', {});
      expect(res.status).toBe(200);
      expect(res.body.membership.termEnd).toBe('2027-12-31');
      expect(await succeededFor(m.memberNumber, '2027-12-31')).toHaveLength(1);
    });
  });
  describe('when the answer to a charge is lost and the member tries again with another card', () => {
    /** The processor takes the money but its reply never arrives: the first charge comes back `unknown`. */
    const loseNextReply = () => {
      const gateway = a.deps.payments;
      const original = gateway.charge.bind(gateway);
      return jest.spyOn(gateway, 'charge').mockImplementationOnce(async (req) => {
        await original(req);
        return { outcome: 'unknown', message: 'The connection closed before the reply.' };
      });
    };
    afterEach(() => jest.restoreAllMocks());

    it('finds the first charge at the processor and charges nothing more', async () => {
      const m = await member(false);
      loseNextReply();
      const lost = await m.post('/api/membership/renew', { paymentToken: 'tok_visa' });
      expect(lost.status).toBe(502);
      expect(lost.body.error.code).toBe('payment_unconfirmed');
      const again = await m.post('/api/membership/renew', { paymentToken: 'tok_mastercard' }, 1);
      expect(again.status).toBe(200);
      expect(again.body.membership.termEnd).toBe('2027-12-31');
      expect(await succeededFor(m.memberNumber, '2027-12-31')).toHaveLength(1);
      const rows = await a.deps.db('membership_payments').where({ membership_id: m.row.id, term_end: '2027-12-31' });
      expect(rows.map((r) => r.status)).toEqual(['paid']);
      // The ledger holds the renewal once, with the charge the processor kept.
      const [charge] = await succeededFor(m.memberNumber, '2027-12-31');
      expect(await a.deps.db('money_movements').where({ processor_charge_id: charge.id })).toHaveLength(1);
    });

    it('closes the unanswered attempt as not charged when the processor has no charge, then charges the new card', async () => {
      const m = await member(false);
      jest
        .spyOn(a.deps.payments, 'charge')
        .mockResolvedValueOnce({ outcome: 'unknown', message: 'The connection closed before the request was sent.' });
      expect((await m.post('/api/membership/renew', { paymentToken: 'tok_visa' })).status).toBe(502);
      const again = await m.post('/api/membership/renew', { paymentToken: 'tok_mastercard' });
      expect(again.status).toBe(200);
      expect(await succeededFor(m.memberNumber, '2027-12-31')).toHaveLength(1);
      const rows = await a.deps
        .db('membership_payments')
        .where({ membership_id: m.row.id, term_end: '2027-12-31' })
        .orderBy('id');
      expect(rows.map((r) => [r.status, r.failure_message])).toEqual([
        ['declined', 'Not charged: the processor holds no charge for this attempt.'],
        ['paid', null],
      ]);
    });
  });
});

describe('POST /api/membership', () => {
  describe.each([
    ['the same card', false, () => 'tok_visa'],
    [
      'a different card each, kept on file',
      true,
      (i: number) => ['tok_visa', 'tok_mastercard', 'tok_ca', 'tok_amex', 'tok_visa_debit'][i],
    ],
  ])('when five joins of one account arrive at once on two processes with %s', (_label, autoRenew, token) => {
    it('creates one membership and charges once', async () => {
      const s = await session();
      const answers = await fire(5, (i) =>
        s.post('/api/membership', joinBody({ autoRenew, paymentToken: token(i) }), i),
      );
      expect(answers.map((r) => r.status).filter((st) => st !== 201 && st !== 409)).toEqual([]);
      expect(answers.some((r) => r.status === 201)).toBe(true);
      const rows = await a.deps.db('memberships').where('user_id', s.user.id);
      expect(rows).toHaveLength(1);
      expect(await succeededFor(rows[0].member_number, '2026-12-31')).toHaveLength(1);
      expect(await a.deps.db('membership_payments').where({ membership_id: rows[0].id, status: 'paid' })).toHaveLength(
        1,
      );
    });
  });
});
