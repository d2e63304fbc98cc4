import { unzipSync, strFromU8 } from 'fflate';
import type { Response } from 'supertest';
import { CheckInTokens } from '../../server/membership/check-in-token';
import { buildTestApp, fixedClock, type TestApp } from '../helpers/test-app';
import { Client, createUser, signedIn, type TestUser } from '../helpers/users';
import { createLaunch } from './launch-fixtures';
import { MB_ADDRESS, methodId, stockSticker } from './shop-fixtures';

// September 2016: no other test file's clock or fixtures fall in this month, so the books' totals below are this file's.
const clock = fixedClock('2016-09-17T16:00:00Z');
const RANGE = 'from=2016-09-01&to=2016-09-30';
let t: TestApp;
let admin: Client;
let rso: Client;

const profile = {
  legalName: 'Wren Abernathy-Quill',
  dateOfBirth: '1988-02-29',
  address: '7 Slough Lane, Gopher Flats, MB',
  phone: '204-555-0177',
  emergencyContact: 'Tamsin Quill, 204-555-0178',
  associationNumber: 'NA-90210',
  associationExpires: '2017-03-31',
  certificationLevel: 'L1',
};

beforeAll(async () => {
  t = buildTestApp({ clock });
  admin = (await signedIn(t.app, t.deps.db, ['fan', 'admin'])).client;
  rso = (await signedIn(t.app, t.deps.db, ['fan', 'range_officer'])).client;
});
afterAll(() => t.close());

/** Reads a whole binary answer (supertest leaves application/zip unparsed otherwise). */
const binary = (res: Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};
const download = async (client: Client) => {
  const res = await client
    .get('/api/account/export')
    .buffer(true)
    .parse(binary as never);
  return { res, files: res.status === 200 ? unzipSync(new Uint8Array(res.body as Buffer)) : {} };
};
const json = (files: Record<string, Uint8Array>, name: string) => JSON.parse(strFromU8(files[name]));

/** A person with an order (shipped, partly refunded), a paid membership with a saved card, a reply and a flight card. */
async function busyPerson(): Promise<{
  client: Client;
  user: TestUser;
  orderId: number;
  orderNumber: string;
  memberNumber: string;
  launchId: number;
  legalName: string;
}> {
  const s = await signedIn(t.app, t.deps.db);
  const legalName = `${profile.legalName} ${s.user.id}`;
  const sticker = await stockSticker(admin, 50);
  const placed = await s.client.post('/api/orders', {
    items: [{ variantId: sticker.variants[0].id, quantity: 3 }],
    shipTo: { ...MB_ADDRESS, name: legalName },
    shippingMethodId: await methodId(s.client, 'canada'),
    email: s.user.email,
    paymentToken: 'tok_visa',
  });
  expect(placed.status).toBe(201);
  const orderId = placed.body.order.id;
  expect((await admin.post(`/api/admin/orders/${orderId}/pack`)).status).toBe(200);
  expect(
    (
      await admin.post(`/api/admin/orders/${orderId}/ship`, {
        carrier: 'Canada Post',
        trackingNumber: '7023 0000 1111',
      })
    ).status,
  ).toBe(200);
  const refund = await admin.agent
    .post(`/api/admin/orders/${orderId}/refund`)
    .set('X-CSRF-Token', await admin.token())
    .set('Idempotency-Key', `privacy-${orderId}-refund-1`)
    .send({ amountCents: 300, reason: 'Scuffed sticker' });
  expect(refund.status).toBe(200);
  const plans = (await s.client.get('/api/membership/plans')).body.items as { code: string; id: number }[];
  const joined = await s.client.post('/api/membership', {
    planId: plans.find((p) => p.code === 'adult')!.id,
    profile: { ...profile, legalName },
    waiverVersion: '2026-1',
    paymentToken: 'tok_visa',
    autoRenew: true,
  });
  expect(joined.status).toBe(201);
  const m = await t.deps
    .db('memberships')
    .where('user_id', s.user.id)
    .first('member_number', 'processor_customer_id', 'status');
  expect(m.processor_customer_id).not.toBeNull();
  const launchId = await createLaunch(rso, '2016-09-17');
  expect((await s.client.post(`/api/launches/${launchId}/rsvp`, { going: true })).status).toBe(200);
  const token = new CheckInTokens(t.config.sessionSecret).sign(m.member_number, clock.now());
  expect((await rso.post(`/api/launches/${launchId}/check-in`, { token })).status).toBe(200);
  const card = await s.client.post(`/api/launches/${launchId}/flights`, {
    rocketName: 'Quill Dart',
    liftoffMassGrams: 110,
    motors: ['C6-5'],
    expectedAltitudeMetres: 180,
    recovery: 'parachute',
    notes: 'Call me on 204-555-0177 if it drifts.',
  });
  expect(card.status).toBe(201);
  return { ...s, orderId, orderNumber: placed.body.order.number, memberNumber: m.member_number, launchId, legalName };
}

/** What the books say about September 2016: the tax report, the revenue report and the ledger's rows. */
async function books() {
  const tax = await admin.get(`/api/admin/reports/tax?${RANGE}`);
  const revenue = await admin.get(`/api/admin/reports/revenue?${RANGE}`);
  const ledger = await admin.get(`/api/admin/reports/ledger.csv?${RANGE}`);
  expect([tax.status, revenue.status, ledger.status]).toEqual([200, 200, 200]);
  return { tax: tax.body, revenue: revenue.body, ledger: ledger.text };
}
const ledgerAmounts = (csv: string) =>
  csv
    .trim()
    .split('\n')
    .slice(1)
    .map((line) => line.replace(/^([^,]*,){4}("[^"]*"|[^,]*),/, '$1<counterparty>,'));

describe('GET /api/account/export', () => {
  it('answers a ZIP with a summary page and one JSON file per part, holding what Padside keeps about the person', async () => {
    const p = await busyPerson();
    const { res, files } = await download(p.client);
    expect([res.status, res.status === 200 ? '' : String(res.body)]).toEqual([200, '']);
    expect(res.headers['content-type']).toBe('application/zip');
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="padside-my-data-2016-09-17\.zip"$/);
    // Other features add their own files (each feature's `personalData`); these are the ones the features here give.
    expect(Object.keys(files)).toEqual(
      expect.arrayContaining(
        [
          'account-links',
          'build-logs-written',
          'flights',
          'launch-check-ins',
          'launch-replies',
          'mail',
          'membership',
          'membership-history',
          'membership-payments',
          'profile',
          'saved-card',
          'shop-orders',
          'sign-ins',
          'sponsor-contact',
        ]
          .map((n) => `${n}.json`)
          .concat('summary.html'),
      ),
    );
    expect(json(files, 'profile.json')).toEqual([
      expect.objectContaining({
        email: p.user.email,
        displayName: 'Test User',
        roles: expect.arrayContaining(['fan', 'member']),
      }),
    ]);
    const [order] = json(files, 'shop-orders.json');
    // 3 stickers at C$4.00 = C$12.00 of goods; the lines, taxes and the C$3.00 refund come with the order.
    expect(order).toMatchObject({
      number: p.orderNumber,
      shipName: p.legalName,
      shipLine1: MB_ADDRESS.line1,
      subtotalCents: 1200,
      refundedCents: 300,
      status: 'shipped',
      trackingNumber: '7023 0000 1111',
    });
    expect(order.lines).toEqual([expect.objectContaining({ quantity: 3, unitPriceCents: 400 })]);
    expect(order.taxes.map((x: { code: string }) => x.code).sort()).toEqual(['GST', 'RST']);
    expect(order.refunds).toEqual([expect.objectContaining({ amountCents: 300, state: 'succeeded' })]);
    expect(json(files, 'membership.json')).toEqual([
      expect.objectContaining({
        memberNumber: p.memberNumber,
        legalName: p.legalName,
        dateOfBirth: '1988-02-29',
        phone: profile.phone,
        emergencyContact: profile.emergencyContact,
        autoRenew: true,
      }),
    ]);
    // The processor customer's id is the processor's handle on the card: it stays out of the file.
    expect(JSON.stringify(json(files, 'membership.json'))).not.toMatch(/processorCustomerId|cus_/);
    expect(json(files, 'membership-payments.json')).toEqual([
      expect.objectContaining({ entry: 'payment', status: 'paid', method: 'card', amountCents: 4500 }),
    ]);
    // The payment fake's tok_visa card: Visa ending 4242 (Stripe's documented test card).
    expect(json(files, 'saved-card.json')).toEqual([
      { brand: 'Visa', last4: '4242', expMonth: expect.any(Number), expYear: expect.any(Number) },
    ]);
    expect(json(files, 'launch-replies.json')).toEqual([
      expect.objectContaining({ launchDate: '2016-09-17', going: true }),
    ]);
    expect(json(files, 'launch-check-ins.json')).toEqual([
      expect.objectContaining({ launchDate: '2016-09-17', memberNumber: p.memberNumber }),
    ]);
    expect(json(files, 'flights.json')).toEqual([
      expect.objectContaining({
        rocketName: 'Quill Dart',
        notes: 'Call me on 204-555-0177 if it drifts.',
        status: 'filed',
      }),
    ]);
    const signIns = json(files, 'sign-ins.json');
    expect(signIns).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ kind: 'familiar_address', ip: expect.any(String) }),
        { kind: 'open_session', expiresAt: expect.any(String) },
      ]),
    );
    // A session id would let the holder of the file act as the person.
    expect(JSON.stringify(signIns)).not.toMatch(/"(sid|sess)"/);
    const sids: { sid: string }[] = await t.deps
      .db('session')
      .whereRaw(`(sess->'passport'->>'user') = ?`, [String(p.user.id)])
      .select('sid');
    expect(sids.length).toBeGreaterThan(0);
    for (const { sid } of sids) expect(JSON.stringify(signIns)).not.toContain(sid);
    expect(json(files, 'mail.json').map((m: { template: string }) => m.template)).toEqual(
      expect.arrayContaining(['shop-order-confirmation', 'membership-receipt']),
    );
    const summary = strFromU8(files['summary.html']);
    expect(summary).toContain(`<strong>${p.user.email}</strong>`);
    expect(summary).toMatch(/<a href="#shop-orders">Orders<\/a> — 1 entry, in <code>shop-orders\.json<\/code>/);
    expect(summary).toContain('Quill Dart');
  });

  it('lists a sponsor contact’s sponsors, and escapes what people typed on the summary page', async () => {
    const s = await signedIn(t.app, t.deps.db, ['fan', 'sponsor']);
    await t.deps.db('users').where('id', s.user.id).update({ display_name: '<img src=x onerror=alert(1)>' });
    const [sponsor] = await t.deps
      .db('sponsors')
      .insert({ slug: `privacy-${s.user.id}`, name: `Coulee Composites ${s.user.id}` })
      .returning('id');
    await t.deps.db('sponsor_contacts').insert({ sponsor_id: sponsor.id, user_id: s.user.id });
    const { files } = await download(s.client);
    expect(json(files, 'sponsor-contact.json')).toEqual([
      expect.objectContaining({ sponsor: `Coulee Composites ${s.user.id}` }),
    ]);
    expect(json(files, 'shop-orders.json')).toEqual([]);
    const summary = strFromU8(files['summary.html']);
    expect(summary).not.toContain('<img src=x');
    expect(summary).toContain('&lt;img src=x onerror=alert(1)&gt;');
  });

  it('includes a guest order placed with the account’s confirmed e-mail, and the deletion erases it too', async () => {
    const s = await signedIn(t.app, t.deps.db);
    const [guest] = await t.deps
      .db('shop_orders')
      .insert({
        email: s.user.email,
        status: 'shipped',
        ship_name: 'Guest Me',
        ship_line1: '3 Gravel Spur',
        ship_city: 'Gopher Flats',
        ship_country: 'CA',
        ship_province: 'MB',
        ship_postal_code: 'R0K 1A0',
        shipping_code: 'canada',
        shipping_name: 'Mail',
        tax_jurisdiction: 'MB',
        priced_on: '2016-09-10',
        weight_grams: 10,
        subtotal_cents: 400,
        discount_cents: 0,
        shipping_cents: 0,
        tax_cents: 48,
        total_cents: 448,
        paid_at: new Date('2016-09-10T18:00:00Z'),
      })
      .returning(['id', 'number']);
    const { files } = await download(s.client);
    expect(json(files, 'shop-orders.json')).toEqual([
      expect.objectContaining({ number: guest.number, shipName: 'Guest Me', totalCents: 448 }),
    ]);
    expect((await s.client.post('/api/account/delete', { password: s.user.password })).status).toBe(200);
    expect(
      await t.deps
        .db('shop_orders')
        .where('id', guest.id)
        .first('email', 'ship_name', 'ship_line1', 'total_cents', 'user_id'),
    ).toEqual({
      email: `deleted-${s.user.id}@deleted.invalid`,
      ship_name: `Deleted account #${s.user.id}`,
      ship_line1: null,
      total_cents: 448,
      user_id: s.user.id,
    });
  });

  it('answers 401 to a visitor', async () => {
    expect((await new Client(t.app).get('/api/account/export')).status).toBe(401);
  });
});

describe('POST /api/account/delete', () => {
  describe('when the password is wrong', () => {
    it('answers 400 naming the password field and changes nothing', async () => {
      const s = await signedIn(t.app, t.deps.db);
      const res = await s.client.post('/api/account/delete', { password: 'not the password at all' });
      expect(res.status).toBe(400);
      expect(res.body.error.fields).toEqual({ password: expect.any(String) });
      expect((await s.client.get('/api/account/profile')).status).toBe(200);
      expect((await t.deps.db('users').where('id', s.user.id).first('deleted_at')).deleted_at).toBeNull();
    });

    it('answers 400 naming the password field when none is sent', async () => {
      const s = await signedIn(t.app, t.deps.db);
      const res = await s.client.post('/api/account/delete', {});
      expect(res.status).toBe(400);
      expect(Object.keys(res.body.error.fields)).toEqual(['password']);
    });
  });

  describe('when an order is paid and not yet sent', () => {
    it('answers 409 naming the order, and the account stays', async () => {
      const s = await signedIn(t.app, t.deps.db);
      const sticker = await stockSticker(admin, 5);
      const placed = await s.client.post('/api/orders', {
        items: [{ variantId: sticker.variants[0].id, quantity: 1 }],
        shipTo: MB_ADDRESS,
        shippingMethodId: await methodId(s.client, 'canada'),
        email: s.user.email,
        paymentToken: 'tok_visa',
      });
      expect(placed.status).toBe(201);
      const res = await s.client.post('/api/account/delete', { password: s.user.password });
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('account_held');
      expect(res.body.error.message).toContain(placed.body.order.number);
      expect((await s.client.get('/api/account/profile')).status).toBe(200);
    });
  });

  describe('when a dues card payment is still under way', () => {
    it('answers 409 and the account stays', async () => {
      const p = await busyPerson();
      await t.deps
        .db('membership_payments')
        .whereIn('membership_id', t.deps.db('memberships').where('user_id', p.user.id).select('id'))
        .update({ status: 'attempted' });
      const res = await p.client.post('/api/account/delete', { password: p.user.password });
      expect(res.status).toBe(409);
      expect(res.body.error.message).toContain('dues payment or refund is still being processed');
      await t.deps
        .db('membership_payments')
        .whereIn('membership_id', t.deps.db('memberships').where('user_id', p.user.id).select('id'))
        .update({ status: 'paid' });
      expect((await p.client.get('/api/account/profile')).status).toBe(200);
    });
  });

  describe('when the password is right', () => {
    it('erases the person, keeps every amount (the books give the same totals), ends the sessions and refuses the e-mail at sign-in', async () => {
      const p = await busyPerson();
      const other = new Client(t.app);
      await other.signIn(p.user);
      const before = await books();
      // The fixtures made real money movements this month: an order, a refund and dues, so the totals can move.
      expect(before.tax.authorities.length).toBeGreaterThan(0);
      expect(before.ledger).toContain(p.user.email);
      expect(before.ledger).toContain(p.legalName);

      const { processor_customer_id: customerId } = await t.deps
        .db('memberships')
        .where('user_id', p.user.id)
        .first('processor_customer_id');
      const res = await p.client.post('/api/account/delete', { password: p.user.password });
      expect(res.status).toBe(200);
      expect(res.body).toEqual({ deleted: true });

      const after = await books();
      expect(after.tax).toEqual(before.tax);
      expect(after.revenue).toEqual(before.revenue);
      expect(ledgerAmounts(after.ledger)).toEqual(ledgerAmounts(before.ledger));
      expect(after.ledger).not.toContain(p.user.email);
      expect(after.ledger).not.toContain(p.legalName);
      expect(after.ledger).toContain(`Deleted account #${p.user.id}`);

      // Sessions: this one and the other browser's are gone, and the e-mail no longer signs in.
      expect((await p.client.get('/api/account/profile')).status).toBe(401);
      expect((await other.get('/api/account/profile')).status).toBe(401);
      expect(
        await t.deps
          .db('session')
          .whereRaw(`(sess->'passport'->>'user') = ?`, [String(p.user.id)])
          .count({ n: '*' }),
      ).toEqual([{ n: 0 }]);
      const signIn = await new Client(t.app).post('/api/auth/login', {
        email: p.user.email,
        password: p.user.password,
      });
      expect(signIn.status).toBe(401);

      // Staff see the deletion as such.
      const order = await admin.get(`/api/admin/orders/${p.orderId}`);
      expect(order.status).toBe(200);
      expect(order.body.order).toMatchObject({
        totalCents: expect.any(Number),
        refundedCents: 300,
        shipTo: expect.objectContaining({
          name: `Deleted account #${p.user.id}`,
          line1: null,
          postalCode: null,
          province: 'MB',
          country: 'CA',
        }),
      });
      expect(JSON.stringify(order.body)).not.toContain(p.user.email);
      const accounts = await admin.get(`/api/admin/users?q=${encodeURIComponent(`Deleted account #${p.user.id}`)}`);
      expect(accounts.body.items).toEqual([
        expect.objectContaining({
          id: p.user.id,
          displayName: `Deleted account #${p.user.id}`,
          roles: [],
          deletedAt: expect.any(String),
        }),
      ]);
      const roles = await admin.patch(`/api/admin/users/${p.user.id}`, { roles: ['fan', 'treasurer'] });
      expect(roles.status).toBe(409);
      expect(roles.body.error.code).toBe('account_deleted');
      const roster = await admin.get(`/api/admin/members?q=${p.memberNumber}`);
      expect(roster.status).toBe(200);
      expect(JSON.stringify(roster.body)).toContain(`Deleted account #${p.user.id}`);
      expect(JSON.stringify(roster.body)).not.toContain(p.legalName);
      const attendance = await rso.get(`/api/admin/launches/${p.launchId}/attendance`);
      expect(attendance.body.items).toEqual([
        expect.objectContaining({ name: `Deleted account #${p.user.id}`, memberNumber: p.memberNumber }),
      ]);

      // What is left in the tables: amounts and the club's records, without the person.
      const db = t.deps.db;
      const m = await db('memberships').where('user_id', p.user.id).first();
      expect(m).toMatchObject({
        legal_name: `Deleted account #${p.user.id}`,
        date_of_birth: null,
        address: '',
        phone: '',
        emergency_contact: '',
        association_number: null,
        status: 'lapsed',
        auto_renew: false,
        processor_customer_id: null,
      });
      expect(await db('membership_payments').where('membership_id', m.id).select('amount_cents', 'status')).toEqual([
        { amount_cents: 4500, status: 'paid' },
      ]);
      expect(await db('launch_rsvps').where('user_id', p.user.id)).toEqual([]);
      expect((await db('flights').where('user_id', p.user.id).first('notes')).notes).toBe('');
      // The card processor keeps the customer (its charges point at it) but no card, name or e-mail.
      const customer = await t.processor.customers.retrieve(customerId);
      // A blanked field reads null from the processor and '' from the payment fake.
      expect(customer).toMatchObject({ default_source: null });
      expect([
        (customer as { email: string | null }).email || null,
        (customer as { name: string | null }).name || null,
      ]).toEqual([null, null]);
      const mail = await db('outbound_emails').where('to_address', p.user.email).select('template');
      expect(mail).toEqual([{ template: 'account-deleted' }]);
    });

    it('lets the e-mail register again as a new account', async () => {
      const s = await signedIn(t.app, t.deps.db);
      expect((await s.client.post('/api/account/delete', { password: s.user.password })).status).toBe(200);
      const again = await t.deps
        .db('users')
        .insert({ email: s.user.email, password_hash: 'x', display_name: 'New me' })
        .returning('id');
      expect(Number(again[0].id)).not.toBe(s.user.id);
    });

    it('lets an admin delete their account while another admin remains', async () => {
      const first = await signedIn(t.app, t.deps.db, ['fan', 'admin']);
      expect((await first.client.post('/api/account/delete', { password: first.user.password })).status).toBe(200);
    });
  });

  describe('when an account asks twice at once', () => {
    it('deletes it once and answers the other request without a 5xx', async () => {
      const user = await createUser(t.deps.db);
      const a = new Client(t.app);
      await a.signIn(user);
      const answers = await Promise.all(
        Array.from({ length: 5 }, () => a.post('/api/account/delete', { password: user.password })),
      );
      const codes = answers.map((r) => r.status).sort();
      expect(codes.filter((c) => c === 200)).toHaveLength(1);
      for (const c of codes) expect(c).toBeLessThan(500);
    });
  });
});
