import { randomUUID } from 'node:crypto';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';
import { MB_ADDRESS, methodId, openShirt } from './shop-fixtures';

// Card testing: declined payments are limited per session, per e-mail and per address (5 in 10 minutes, Padside's
// own numbers: common practice, no source). Every e-mail and street here is this file's own, so the counts of the
// other test files (which share MB_ADDRESS) are never touched.
let t: TestApp;
let staff: Client;
let shirt: Awaited<ReturnType<typeof openShirt>>;

beforeAll(async () => {
  t = buildTestApp();
  staff = (await signedIn(t.app, t.deps.db, ['fan', 'treasurer'])).client;
  shirt = await openShirt(staff, { cap: 500 });
});
afterAll(() => t.close());

const uniqueEmail = () => `card-${randomUUID().slice(0, 8)}@example.test`;
const uniqueStreet = () => `${Math.floor(Math.random() * 9000) + 100} Throttle ${randomUUID().slice(0, 6)} Rd`;

async function checkout(c: Client, opts: { email?: string; street?: string; token?: string } = {}) {
  return c.post('/api/orders', {
    items: [{ variantId: shirt.variants[0].id, quantity: 1 }],
    shipTo: { ...MB_ADDRESS, line1: opts.street ?? uniqueStreet() },
    shippingMethodId: await methodId(c, 'canada'),
    email: opts.email ?? uniqueEmail(),
    paymentToken: opts.token ?? 'tok_chargeDeclined',
  });
}

function expectLimited(res: {
  status: number;
  headers: Record<string, string>;
  body: { error: { code: string; fields?: Record<string, string> } };
}) {
  expect(res.status).toBe(429);
  expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
  expect(Number(res.headers['retry-after'])).toBeLessThanOrEqual(600);
  expect(res.body.error.code).toBe('payment_attempts_limited');
  expect(res.body.error.fields?.paymentToken).toMatch(/declined payments/);
}

describe('V11.1.4 declined payments are throttled against card testing (OWASP ASVS 4.0.3 11.1.4: anti-automation)', () => {
  it('answers the 6th checkout from one session with 429 and Retry-After, without reserving units or charging', async () => {
    const c = new Client(t.app);
    for (let i = 0; i < 5; i++) expect((await checkout(c)).status).toBe(402);
    const email = uniqueEmail();
    const sixth = await checkout(c, { email, token: 'tok_visa' });
    expectLimited(sixth);
    expect(await t.deps.db('shop_orders').where({ email })).toHaveLength(0);
  });

  it('counts one e-mail across sessions and addresses', async () => {
    const email = uniqueEmail();
    for (let i = 0; i < 5; i++)
      expect((await checkout(new Client(t.app), { email: email.toUpperCase() })).status).toBe(402);
    expectLimited(await checkout(new Client(t.app), { email }));
  });

  it('counts one street address across sessions and e-mails', async () => {
    const street = uniqueStreet();
    for (let i = 0; i < 5; i++) expect((await checkout(new Client(t.app), { street })).status).toBe(402);
    expectLimited(await checkout(new Client(t.app), { street: street.toUpperCase() }));
  });

  it('starts the counts again after a payment goes through', async () => {
    const c = new Client(t.app);
    for (let i = 0; i < 4; i++) expect((await checkout(c)).status).toBe(402);
    expect((await checkout(c, { token: 'tok_visa' })).status).toBe(201);
    for (let i = 0; i < 5; i++) expect((await checkout(c)).status).toBe(402);
    expectLimited(await checkout(c));
  });

  it('throttles another attempt on an existing order the same way (POST /api/orders/:id/pay)', async () => {
    const c = new Client(t.app);
    const street = uniqueStreet();
    for (let i = 0; i < 4; i++) expect((await checkout(c, { street })).status).toBe(402);
    const paid = await checkout(c, { street, token: 'tok_visa' });
    expect(paid.status).toBe(201);
    // The success started the counts again; after five more declines even this order's retry is refused up front.
    for (let i = 0; i < 5; i++) expect((await checkout(c)).status).toBe(402);
    expectLimited(await c.post(`/api/orders/${paid.body.order.id}/pay`, { paymentToken: 'tok_visa' }));
  });

  it('throttles a member’s declined dues payments per account', async () => {
    const { client } = await signedIn(t.app, t.deps.db);
    const plans = (await client.get('/api/membership/plans')).body.items as { code: string; id: number }[];
    const body = (paymentToken: string) => ({
      planId: plans.find((p) => p.code === 'adult')!.id,
      profile: {
        legalName: 'Tamsin Throttle',
        dateOfBirth: '1988-02-03',
        address: '9 Coulee Road, Gopher Flats, MB',
        phone: '204-555-0177',
        emergencyContact: 'Ivo Throttle, 204-555-0178',
        associationNumber: 'NA-77120',
        associationExpires: '2027-12-31',
        certificationLevel: 'L1',
      },
      waiverVersion: '2026-1',
      paymentToken,
    });
    for (let i = 0; i < 5; i++)
      expect((await client.post('/api/membership', body('tok_chargeDeclined'))).status).toBe(402);
    expectLimited(await client.post('/api/membership', body('tok_visa')));
  });
});
