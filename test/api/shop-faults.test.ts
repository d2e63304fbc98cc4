import { buildTestApp, fixedClock, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';
import { chain, MB_ADDRESS, methodId, openShirt } from './shop-fixtures';

let t: TestApp;
let staff: Client;
const clock = fixedClock(new Date().toISOString());

beforeAll(async () => {
  t = buildTestApp({ clock });
  staff = (await signedIn(t.app, t.deps.db, ['fan', 'admin'])).client;
});
afterAll(() => t.close());

const chargesFor = async (orderId: number) =>
  (await t.processor.charges.list({ limit: 100 })).data.filter((c) => c.metadata.orderId === String(orderId));
const later = (minutes: number) => clock.set(new Date(clock.now().getTime() + minutes * 60_000).toISOString());

async function placeWith(token: string) {
  const shirt = await openShirt(staff, { cap: 3 });
  const c = new Client(t.app);
  const res = await c.post('/api/orders', {
    items: [{ variantId: shirt.variants[0].id, quantity: 2 }],
    shipTo: MB_ADDRESS,
    shippingMethodId: await methodId(c, 'pickup'),
    email: 'unsure@example.test',
    paymentToken: token,
  });
  return { c, res, shirt };
}

describe('POST /api/orders when the processor answers 500 (tok_500|tok_visa|…)', () => {
  it('answers 202 pending with the units held, and the buyer’s second attempt pays once', async () => {
    const token = chain('tok_500');
    const { c, res, shirt } = await placeWith(token);
    expect(res.status).toBe(202);
    expect(res.body.order.status).toBe('pending');
    expect(res.body.message).toMatch(/could not confirm/i);
    expect((await t.deps.db('shop_runs').where('id', shirt.run.id).first()).reserved).toBe(2);
    expect(await chargesFor(res.body.order.id)).toHaveLength(0);

    const again = await c.post(`/api/orders/${res.body.order.id}/pay`, { paymentToken: token });
    expect(again.status).toBe(200);
    expect(again.body.order.status).toBe('paid');
    expect(await chargesFor(res.body.order.id)).toHaveLength(1);
    // A third click finds it paid and charges nothing more.
    expect((await c.post(`/api/orders/${res.body.order.id}/pay`, { paymentToken: 'tok_visa' })).body.order.status).toBe(
      'paid',
    );
    expect(await chargesFor(res.body.order.id)).toHaveLength(1);
    expect(
      (await t.deps.db('money_movements').where({ reference: res.body.order.number }).count('* as n').first())!.n,
    ).toBe(1);
  });
});

describe('the reconciliation job', () => {
  const job = () => t.app.jobs.find((j) => j.name === 'shop-reconcile-payments')!;

  it('leaves a fresh pending order alone, then releases its units when the processor has no charge', async () => {
    const { res, shirt } = await placeWith(chain('tok_500'));
    expect(await job().run()).toMatchObject({ paid: 0 });
    expect((await t.deps.db('shop_orders').where('id', res.body.order.id).first()).status).toBe('pending');
    later(11);
    await job().run();
    expect((await t.deps.db('shop_orders').where('id', res.body.order.id).first()).status).toBe('failed');
    expect((await t.deps.db('shop_runs').where('id', shirt.run.id).first()).reserved).toBe(0);
  });

  it('marks the order paid when the processor did take the money', async () => {
    const { res } = await placeWith(chain('tok_500'));
    // The processor took the charge even though our request saw a 500.
    await t.processor.charges.create({
      amount: res.body.order.totalCents,
      currency: 'cad',
      source: 'tok_visa',
      metadata: { orderId: String(res.body.order.id) },
    });
    later(11);
    await job().run();
    const row = await t.deps.db('shop_orders').where('id', res.body.order.id).first();
    expect(row.status).toBe('paid');
    expect(row.charge_id).toMatch(/^ch_/);
    expect(
      (await t.deps
        .db('outbound_emails')
        .where({ dedupe_key: `shop-confirmation-${res.body.order.id}` })
        .count('* as n')
        .first())!.n,
    ).toBe(1);
  });
});

describe('POST /api/orders/:id/pay twice at once', () => {
  it('charges the card once: the other click answers 409 (in progress) or 200 (already paid)', async () => {
    const { c, res } = await placeWith(chain('tok_500'));
    const [a, b] = await Promise.all([
      c.post(`/api/orders/${res.body.order.id}/pay`, { paymentToken: 'tok_visa' }),
      c.post(`/api/orders/${res.body.order.id}/pay`, { paymentToken: 'tok_visa' }),
    ]);
    expect([a.status, b.status]).toContain(200);
    expect([a.status, b.status].every((s) => s === 200 || s === 409)).toBe(true);
    expect(await chargesFor(res.body.order.id)).toHaveLength(1);
  });
});
