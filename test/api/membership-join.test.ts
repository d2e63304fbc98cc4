import { buildTestApp, fixedClock, type TestApp } from '../helpers/test-app';
import { signedIn } from '../helpers/users';

const clock = fixedClock('2026-06-15T17:00:00Z');
let t: TestApp;
let plans: Record<string, number>;

const profile = (over: Record<string, unknown> = {}) => ({
  legalName: 'Odessa Featherstonehaugh',
  dateOfBirth: '1990-04-12',
  address: '14 Coulee Road, Gopher Flats, MB',
  phone: '204-555-0142',
  emergencyContact: 'Bram Featherstonehaugh, 204-555-0143',
  associationNumber: 'NA-55102',
  associationExpires: '2027-03-31',
  certificationLevel: 'L1',
  ...over,
});

beforeAll(async () => {
  t = buildTestApp({ clock });
  const res = await (await signedIn(t.app, t.deps.db)).client.get('/api/membership/plans');
  plans = Object.fromEntries(res.body.items.map((p: { code: string; id: number }) => [p.code, p.id]));
});
afterAll(() => t.close());
beforeEach(() => clock.set('2026-06-15T17:00:00Z'));

const join = async (body: Record<string, unknown> = {}) => {
  const s = await signedIn(t.app, t.deps.db);
  const res = await s.client.post('/api/membership', {
    planId: plans.adult,
    profile: profile(),
    waiverVersion: '2026-1',
    paymentToken: 'tok_visa',
    ...body,
  });
  return { ...s, res };
};

const rolesOf = async (userId: number) =>
  (await t.deps.db('users').where('id', userId).first('roles')).roles as string[];

describe('GET /api/membership/plans', () => {
  it('lists the adult, junior and family plans with dues', async () => {
    const res = await (await signedIn(t.app, t.deps.db)).client.get('/api/membership/plans');
    expect(res.status).toBe(200);
    expect(res.body.items.map((p: { code: string }) => p.code)).toEqual(
      expect.arrayContaining(['adult', 'junior', 'family']),
    );
    expect(res.body.items[0]).toEqual(
      expect.objectContaining({ id: expect.any(Number), name: expect.any(String), duesCents: expect.any(Number) }),
    );
  });
});

describe('POST /api/membership/quote', () => {
  it('quotes the calendar year for a June payment and both years from Sep 1 (late-season rule: common practice, no source)', async () => {
    const s = await signedIn(t.app, t.deps.db);
    const june = await s.client.post('/api/membership/quote', { planId: plans.adult });
    expect(june.body).toEqual(
      expect.objectContaining({ amountCents: 4500, termStart: '2026-06-15', termEnd: '2026-12-31' }),
    );
    const sept = await s.client.post('/api/membership/quote', { planId: plans.adult, on: '2026-09-01' });
    expect(sept.body).toEqual(expect.objectContaining({ termStart: '2026-09-01', termEnd: '2027-12-31' }));
  });

  it('answers 400 with a field message for a bad date', async () => {
    const res = await (
      await signedIn(t.app, t.deps.db)
    ).client.post('/api/membership/quote', { planId: plans.adult, on: '2026-02-30x' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.on).toBeDefined();
  });
});

describe('POST /api/membership', () => {
  describe('when the card is accepted', () => {
    it('answers 201 with an active membership, grants the member role and queues a receipt', async () => {
      const { res, user } = await join();
      expect(res.status).toBe(201);
      expect(res.body.membership).toEqual(
        expect.objectContaining({
          status: 'active',
          termStart: '2026-06-15',
          termEnd: '2026-12-31',
          planId: plans.adult,
          memberNumber: expect.stringMatching(/^\d{5}$/),
        }),
      );
      expect(await rolesOf(user.id)).toContain('member');
      const receipts = await t.deps
        .db('outbound_emails')
        .where({ to_address: user.email, template: 'membership-receipt' });
      expect(receipts).toHaveLength(1);
      expect(receipts[0].text_body).toContain('Jun 15, 2026 to Dec 31, 2026');
      const row = await t.deps.db('memberships').where('user_id', user.id).first();
      expect(row.waiver_version).toBe('2026-1');
      expect(row.waiver_accepted_at).toEqual(clock.now());
    });

    // Stripe Canadian pricing: 2.9% + C$0.30 domestic [secondary copy], +0.8% for an international card (Stripe Support, October 2023).
    it('records the dues in the ledger with an estimated card fee and no tax lines', async () => {
      const { res } = await join({ paymentToken: 'tok_ca' });
      const movement = await t.deps
        .db('money_movements')
        .where({ reference: res.body.membership.memberNumber, source: 'dues' })
        .first();
      // Canadian card: 2.9% of 4500 = 130.5 -> 131 (half-up) + 30 = 161.
      expect(movement).toEqual(
        expect.objectContaining({
          kind: 'dues_payment',
          method: 'card',
          gross_cents: 4500,
          fee_cents: 161,
          fee_estimated: true,
        }),
      );
      expect(await t.deps.db('money_movement_taxes').where('movement_id', movement.id)).toEqual([]);
    });

    it('estimates the international rate for a card issued abroad', async () => {
      const { res } = await join({ paymentToken: 'tok_visa' });
      const movement = await t.deps
        .db('money_movements')
        .where({ reference: res.body.membership.memberNumber, source: 'dues' })
        .first();
      // The fake issues tok_visa in the US: 3.7% of 4500 = 166.5 -> 167 + 30 = 197.
      expect(movement.fee_cents).toBe(197);
    });

    it('gives every member a different number', async () => {
      const a = await join();
      const b = await join();
      expect(a.res.body.membership.memberNumber).not.toBe(b.res.body.membership.memberNumber);
    });
  });

  describe('when the card is declined', () => {
    it('answers 402 with the message on the card field and leaves the membership pending', async () => {
      const { res, user } = await join({ paymentToken: 'tok_chargeDeclined' });
      expect(res.status).toBe(402);
      expect(res.body.error.fields.paymentToken).toMatch(/declined/i);
      const row = await t.deps.db('memberships').where('user_id', user.id).first();
      expect(row.status).toBe('pending');
      expect(await rolesOf(user.id)).not.toContain('member');
      expect(await t.deps.db('membership_payments').where({ membership_id: row.id, status: 'declined' })).toHaveLength(
        1,
      );
    });

    it('keeps the number when the second attempt succeeds', async () => {
      const s = await join({ paymentToken: 'tok_chargeDeclined' });
      const number = (await t.deps.db('memberships').where('user_id', s.user.id).first()).member_number;
      const again = await s.client.post('/api/membership', {
        planId: plans.adult,
        profile: profile(),
        waiverVersion: '2026-1',
        paymentToken: 'tok_visa',
      });
      expect(again.status).toBe(201);
      expect(again.body.membership.memberNumber).toBe(number);
    });
  });

  describe('when the input is wrong', () => {
    it('answers 400 on the plan for a junior plan taken by an adult', async () => {
      const { res } = await join({ planId: plans.junior });
      expect(res.status).toBe(400);
      expect(res.body.error.fields.planId).toBeDefined();
    });

    it('accepts a junior plan for someone under 18 on the first day of the term', async () => {
      const { res } = await join({ planId: plans.junior, profile: profile({ dateOfBirth: '2008-06-16' }) });
      expect(res.status).toBe(201);
      expect(res.body.membership.planId).toBe(plans.junior);
    });

    it('refuses the junior plan for someone who turns 18 on the first day of the term', async () => {
      const { res } = await join({ planId: plans.junior, profile: profile({ dateOfBirth: '2008-06-15' }) });
      expect(res.status).toBe(400);
    });

    it('answers 400 on the waiver when an old version is sent', async () => {
      const { res } = await join({ waiverVersion: '2019-1' });
      expect(res.status).toBe(400);
      expect(res.body.error.fields.waiverVersion).toMatch(/2026-1/);
    });

    it('answers 400 per field for a missing profile', async () => {
      const { res } = await join({ profile: { legalName: '' } });
      expect(res.status).toBe(400);
      expect(res.body.error.fields['profile.legalName']).toBeDefined();
      expect(res.body.error.fields['profile.phone']).toBeDefined();
    });

    it('never answers 5xx and keeps one membership when the form is submitted twice at once', async () => {
      const s = await signedIn(t.app, t.deps.db);
      const body = { planId: plans.adult, profile: profile(), waiverVersion: '2026-1', paymentToken: 'tok_visa' };
      const answers = await Promise.all([
        s.client.post('/api/membership', body),
        s.client.post('/api/membership', body),
      ]);
      expect(answers.map((r) => r.status).every((code) => code < 500)).toBe(true);
      expect(answers.some((r) => r.status === 201)).toBe(true);
      expect(await t.deps.db('memberships').where('user_id', s.user.id)).toHaveLength(1);
    });

    it('answers 400 on the card field for a token that is not one, as the shop does, before asking the processor', async () => {
      for (const paymentToken of ['tok visa', '<b>tok</b>', 'x']) {
        const { res } = await join({ paymentToken });
        expect(res.status).toBe(400);
        expect(res.body.error.fields.paymentToken).toMatch(/card/i);
      }
    });

    it('answers 409 for a second join', async () => {
      const s = await join();
      const again = await s.client.post('/api/membership', {
        planId: plans.adult,
        profile: profile(),
        waiverVersion: '2026-1',
        paymentToken: 'tok_visa',
      });
      expect(again.status).toBe(409);
    });
  });
});

describe('GET /api/membership/me', () => {
  it('answers 200 with no membership before the caller joins (not a 404 the browser logs as an error)', async () => {
    const res = await (await signedIn(t.app, t.deps.db)).client.get('/api/membership/me');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ membership: null });
  });
});

describe('PATCH /api/membership/me', () => {
  it('updates the association expiry with an audit entry, and answers 400 beside a bad level', async () => {
    const s = await join();
    const res = await s.client.patch('/api/membership/me', {
      associationExpires: '2028-03-31',
      certificationLevel: 'L2',
    });
    expect(res.status).toBe(200);
    expect(res.body.membership).toEqual(
      expect.objectContaining({ associationExpires: '2028-03-31', certificationLevel: 'L2' }),
    );
    const row = await t.deps.db('memberships').where('user_id', s.user.id).first('id');
    expect(
      await t.deps.db('membership_audit').where({ membership_id: row.id, action: 'profile_updated' }),
    ).toHaveLength(1);
    const bad = await s.client.patch('/api/membership/me', { certificationLevel: 'L7', associationExpires: 'soon' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.associationExpires).toBeDefined();
  });
});

describe('POST /api/membership/renew', () => {
  it('extends an early renewal from the current end', async () => {
    const s = await join();
    clock.set('2026-11-20T17:00:00Z');
    const res = await s.client.post('/api/membership/renew', { paymentToken: 'tok_visa' });
    expect(res.status).toBe(200);
    expect(res.body.membership).toEqual(
      expect.objectContaining({
        termStart: '2027-01-01',
        termEnd: '2027-12-31',
        status: 'active',
        memberNumber: s.res.body.membership.memberNumber,
      }),
    );
  });

  // The member's record is moved back a version rather than the club's setting forward: the setting is shared with
  // every suite running at the same time.
  it('asks again for a new waiver version', async () => {
    const s = await join();
    await t.deps.db('memberships').where('user_id', s.user.id).update({ waiver_version: '2025-1' });
    const refused = await s.client.post('/api/membership/renew', { paymentToken: 'tok_visa' });
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields.waiverVersion).toMatch(/2026-1/);
    const ok = await s.client.post('/api/membership/renew', { paymentToken: 'tok_visa', waiverVersion: '2026-1' });
    expect(ok.status).toBe(200);
    expect((await t.deps.db('memberships').where('user_id', s.user.id).first()).waiver_version).toBe('2026-1');
  });

  it('starts a new term after grace, keeps the number, and the card page carries a signed token', async () => {
    const s = await join();
    clock.set('2027-02-10T17:00:00Z');
    expect((await s.client.get('/api/membership/me')).body.membership.status).toBe('lapsed');
    expect(await rolesOf(s.user.id)).not.toContain('member');
    const res = await s.client.post('/api/membership/renew', { paymentToken: 'tok_visa' });
    expect(res.body.membership).toEqual(
      expect.objectContaining({
        termStart: '2027-02-10',
        termEnd: '2027-12-31',
        status: 'active',
        memberNumber: s.res.body.membership.memberNumber,
      }),
    );
    expect(await rolesOf(s.user.id)).toContain('member');
    const card = await s.client.get('/api/membership/card');
    expect(card.body.card.qrSvg).toMatch(/^<svg/);
    expect(card.body.card.token.split('.')[1]).toBe(s.res.body.membership.memberNumber);
  });
});

describe('POST /api/membership/auto-renew', () => {
  it('keeps the brand and last four of the card the processor saved, and of the card that replaces it', async () => {
    const s = await join({ paymentToken: 'tok_mastercard', autoRenew: true });
    expect(s.res.status).toBe(201);
    // The processor's test cards: tok_mastercard is a Mastercard ending 4444, tok_ca a Visa ending 0000 (the payment fake's fixtures).
    expect((await s.client.get('/api/membership/me')).body.membership).toEqual(
      expect.objectContaining({ hasSavedCard: true, savedCard: { brand: 'MasterCard', last4: '4444' } }),
    );
    const replaced = await s.client.post('/api/membership/auto-renew', { autoRenew: true, paymentToken: 'tok_ca' });
    expect(replaced.status).toBe(200);
    expect(replaced.body.membership).toEqual(
      expect.objectContaining({ autoRenew: true, savedCard: { brand: 'Visa', last4: '0000' } }),
    );
  });

  it('names no card when none is on file, and answers 400 on the card field when auto-renew is asked for without one', async () => {
    const s = await join();
    expect(s.res.body.membership).toEqual(
      expect.objectContaining({ hasSavedCard: false, savedCard: null, autoRenew: false }),
    );
    const res = await s.client.post('/api/membership/auto-renew', { autoRenew: true });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.paymentToken).toBe('Choose a card to keep on file.');
    expect((await s.client.get('/api/membership/me')).body.membership.autoRenew).toBe(false);
  });

  it('answers 400 for a token that is not one', async () => {
    const s = await join();
    const res = await s.client.post('/api/membership/auto-renew', { autoRenew: true, paymentToken: 'tok_visa; drop' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.paymentToken).toBe('Not a card token.');
  });
});
