import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, createUser, signedIn } from '../helpers/users';
import { MB_ADDRESS, methodId, openShirt } from './shop-fixtures';

// Who may see what: orders belong to their buyer, the treasurer and the admin; sponsor money to the treasurer and admin.
let t: TestApp;
let treasurer: Client;
let admin: Client;
let editor: Client;

beforeAll(async () => {
  t = buildTestApp();
  treasurer = (await signedIn(t.app, t.deps.db, ['fan', 'treasurer'])).client;
  admin = (await signedIn(t.app, t.deps.db, ['fan', 'admin'])).client;
  editor = (await signedIn(t.app, t.deps.db, ['fan', 'editor'])).client;
});
afterAll(() => t.close());

async function placeOrder(buyer: Client, email: string) {
  const shirt = await openShirt(treasurer);
  const res = await buyer.post('/api/orders', {
    items: [{ variantId: shirt.variants[0].id, quantity: 1 }],
    shipTo: MB_ADDRESS,
    shippingMethodId: await methodId(buyer, 'canada'),
    email,
    paymentToken: 'tok_visa',
  });
  expect(res.status).toBe(201);
  return res.body.order.id as number;
}

describe('V4.2.1 orders are only for their buyer, the treasurer and the admin (OWASP ASVS 4.0.3 4.2.1, 4.1.3)', () => {
  it('answers the buyer, the treasurer and the admin, and every other caller exactly like an anonymous one', async () => {
    const { client: buyer, user } = await signedIn(t.app, t.deps.db, ['fan']);
    const id = await placeOrder(buyer, user.email);
    for (const c of [buyer, treasurer, admin]) expect((await c.get(`/api/orders/${id}`)).status).toBe(200);

    const anonymous = await new Client(t.app).get(`/api/orders/${id}`);
    expect(anonymous.status).toBe(404);
    const strangers = [
      editor,
      (await signedIn(t.app, t.deps.db, ['fan'])).client,
      (await signedIn(t.app, t.deps.db, ['fan', 'sponsor'])).client,
      (await signedIn(t.app, t.deps.db, ['fan', 'member'])).client,
    ];
    for (const c of strangers) {
      const res = await c.get(`/api/orders/${id}`);
      expect(res.status).toBe(404);
      expect(res.body).toEqual(anonymous.body);
      expect(JSON.stringify(res.body)).not.toContain(user.email);
    }
  });

  it('refuses an editor’s payment attempt on someone’s order with 404 and leaves the order as it was', async () => {
    const { client: buyer, user } = await signedIn(t.app, t.deps.db, ['fan']);
    const id = await placeOrder(buyer, user.email);
    const before = await t.deps.db('shop_orders').where({ id }).first();
    const res = await editor.post(`/api/orders/${id}/pay`, { paymentToken: 'tok_chargeDeclined' });
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
    const after = await t.deps.db('shop_orders').where({ id }).first();
    expect(after).toMatchObject({ status: before.status, payment_attempts: before.payment_attempts });
  });

  it('keeps a guest’s own order readable in the browser session that placed it, and nowhere else', async () => {
    const guest = new Client(t.app);
    const id = await placeOrder(guest, 'guest-scope@example.test');
    expect((await guest.get(`/api/orders/${id}`)).status).toBe(200);
    expect((await new Client(t.app).get(`/api/orders/${id}`)).status).toBe(404);
    expect((await editor.get(`/api/orders/${id}`)).status).toBe(404);
  });
});

/** A sponsor with a cash and in-kind agreement and a contact, made by the admin. */
async function sponsorWithMoney() {
  const created = await admin.post('/api/admin/sponsors', {
    name: `Scope Test Parts ${Date.now()}`,
    website: 'https://example.test',
    blurb: 'Invented for a test.',
  });
  expect(created.status).toBe(201);
  const id = created.body.id as number;
  const agreement = await admin.post(`/api/admin/sponsors/${id}/agreements`, {
    season: '2026',
    cashCents: 45_600,
    note: 'Deal struck at the autumn launch.',
    inKind: [{ description: 'Nose cone blanks', valueCents: 7_800 }],
    deliverables: [{ kind: 'build_log_credit', quantity: 2, dueOn: '2026-12-31' }],
  });
  expect(agreement.status).toBe(201);
  const contact = await createUser(t.deps.db, ['fan', 'sponsor'], 'Scope Contact');
  expect((await admin.post(`/api/admin/sponsors/${id}/contacts`, { userId: contact.id })).status).toBe(201);
  return { id, contact };
}

describe('V4.1.3 sponsor money and contact e-mails only for the treasurer and the admin (OWASP ASVS 4.0.3 4.1.3, 8.3.1)', () => {
  it('gives an editor the deliverables without cash, declared values, the note or contact e-mails', async () => {
    const s = await sponsorWithMoney();
    const ledger = await editor.get(`/api/admin/sponsors/${s.id}/ledger`);
    expect(ledger.status).toBe(200);
    const [a] = ledger.body.agreements;
    expect(a.deliverables).toEqual([expect.objectContaining({ kind: 'build_log_credit', promised: 2 })]);
    for (const key of ['cashCents', 'cashReceivedOn', 'inKind', 'inKindCents', 'totalCents', 'note'])
      expect(a).not.toHaveProperty(key);
    expect(JSON.stringify(ledger.body)).not.toMatch(/45600|7800|Nose cone|autumn launch/);

    const detail = await editor.get(`/api/admin/sponsors/${s.id}`);
    expect(detail.status).toBe(200);
    expect(detail.body.contacts).toEqual([{ userId: s.contact.id, displayName: 'Scope Contact' }]);
    expect(JSON.stringify(detail.body)).not.toContain(s.contact.email);

    const list = await editor.get('/api/admin/sponsors');
    const row = list.body.items.find((x: { id: number }) => x.id === s.id);
    expect(row).toBeDefined();
    expect(row).not.toHaveProperty('seasonTotalCents');
  });

  it.each([['treasurer'], ['admin']])('gives the %s the money and the contact e-mails', async (who) => {
    const s = await sponsorWithMoney();
    const c = who === 'treasurer' ? treasurer : admin;
    const [a] = (await c.get(`/api/admin/sponsors/${s.id}/ledger`)).body.agreements;
    // 456.00 cash + 78.00 declared in kind = 534.00 (common practice, no source: plain addition).
    expect(a).toMatchObject({
      cashCents: 45_600,
      inKindCents: 7_800,
      totalCents: 53_400,
      note: 'Deal struck at the autumn launch.',
    });
    expect((await c.get(`/api/admin/sponsors/${s.id}`)).body.contacts).toEqual([
      { userId: s.contact.id, email: s.contact.email, displayName: 'Scope Contact' },
    ]);
    const row = (await c.get('/api/admin/sponsors')).body.items.find((x: { id: number }) => x.id === s.id);
    expect(row.seasonTotalCents).toBe(53_400);
  });
});
