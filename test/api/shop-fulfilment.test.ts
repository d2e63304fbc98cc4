import { emailsTo, waitForEmails } from '../helpers/maildev';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';
import { MB_ADDRESS, methodId, openShirt, stockSticker } from './shop-fixtures';

let t: TestApp;
let staff: Client;

beforeAll(async () => {
  t = buildTestApp();
  staff = (await signedIn(t.app, t.deps.db, ['fan', 'treasurer'])).client;
});
afterAll(() => t.close());

let n = 0;
async function order(variantId: number, quantity = 1, email = `buyer-${Date.now()}-${n++}@example.test`) {
  const c = new Client(t.app);
  const res = await c.post('/api/orders', {
    items: [{ variantId, quantity }],
    shipTo: MB_ADDRESS,
    shippingMethodId: await methodId(c, 'canada'),
    email,
    paymentToken: 'tok_visa',
  });
  if (res.status !== 201) throw new Error(JSON.stringify(res.body));
  return res.body.order as { id: number; number: string; totalCents: number; email: string };
}

describe('POST /api/admin/orders/:id/ship', () => {
  it('needs carrier and tracking, then marks shipped and the notice is sent', async () => {
    const shirt = await openShirt(staff);
    const o = await order(shirt.variants[0].id);
    const bad = await staff.post(`/api/admin/orders/${o.id}/ship`, { carrier: '', trackingNumber: '=cmd' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['carrier', 'trackingNumber']);
    expect((await staff.post(`/api/admin/orders/${o.id}/pack`)).body.order.status).toBe('packed');
    // A pre-order waits for its run: no shipping before the run is printed.
    const early = await staff.post(`/api/admin/orders/${o.id}/ship`, {
      carrier: 'Canada Post',
      trackingNumber: '7023 1234 5678',
    });
    expect(early.status).toBe(409);
    expect(early.body.error.code).toBe('run_not_printed');
    expect((await staff.get(`/api/admin/orders/${o.id}`)).body.order.awaitingPrint).toHaveLength(1);
    for (const state of ['closed', 'in_production', 'shipped'])
      expect((await staff.post(`/api/admin/runs/${shirt.run.id}/state`, { state })).status).toBe(200);
    expect((await staff.get(`/api/admin/orders/${o.id}`)).body.order.awaitingPrint).toEqual([]);
    const res = await staff.post(`/api/admin/orders/${o.id}/ship`, {
      carrier: 'Canada Post',
      trackingNumber: '7023 1234 5678',
    });
    expect(res.body.order).toMatchObject({
      status: 'shipped',
      carrier: 'Canada Post',
      trackingNumber: '7023 1234 5678',
    });
    expect(
      (await staff.post(`/api/admin/orders/${o.id}/ship`, { carrier: 'Canada Post', trackingNumber: '7023 1234 5678' }))
        .status,
    ).toBe(409);
    await t.deps.mail.deliverDue();
    const mails = await waitForEmails(o.email, /on its way/);
    expect(mails[0].text).toContain('7023 1234 5678');
  });
});

describe('POST /api/admin/orders/:id/refund', () => {
  it('refunds part, then the rest with restock; never more than was paid', async () => {
    const shirt = await openShirt(staff, { cap: 5 });
    const o = await order(shirt.variants[0].id, 2);
    const part = await staff.post(`/api/admin/orders/${o.id}/refund`, { amountCents: 1000 });
    expect(part.status).toBe(200);
    expect(part.body.order.refundedCents).toBe(1000);
    // More than is left (the first refund took part of it) is a conflict with what was already refunded.
    const tooMuch = await staff.post(`/api/admin/orders/${o.id}/refund`, { amountCents: o.totalCents });
    expect(tooMuch.status).toBe(409);
    expect(tooMuch.body.error.code).toBe('over_refund');
    expect(tooMuch.body.error.fields).toHaveProperty('amountCents');
    expect((await t.deps.db('shop_runs').where('id', shirt.run.id).first()).reserved).toBe(2);
    const rest = await staff.post(`/api/admin/orders/${o.id}/refund`, {
      amountCents: o.totalCents - 1000,
      restock: true,
    });
    expect(rest.body.order.refundedCents).toBe(o.totalCents);
    expect((await t.deps.db('shop_runs').where('id', shirt.run.id).first()).reserved).toBe(0);
    const moves = await t.deps.db('money_movements').where({ reference: o.number, kind: 'refund' }).orderBy('id');
    expect(moves.map((m) => Number(m.gross_cents))).toEqual([-1000, -(o.totalCents - 1000)]);
    // The refunded tax adds up to the tax charged once the whole order is refunded.
    const refundedTax = await t.deps
      .db('money_movement_taxes')
      .whereIn(
        'movement_id',
        moves.map((m) => m.id),
      )
      .sum('tax_cents as s')
      .first();
    const charged = await t.deps.db('shop_orders').where('id', o.id).first();
    expect(-Number(refundedTax!.s)).toBe(charged.tax_cents);
    const charge = await t.processor.charges.retrieve(charged.charge_id);
    expect(charge.amount_refunded).toBe(o.totalCents);
  });

  it('answers 409 with the processor’s reason when the processor does not know the charge (the fake after a restart)', async () => {
    const shirt = await openShirt(staff);
    const o = await order(shirt.variants[0].id);
    await t.deps.db('shop_orders').where('id', o.id).update({ charge_id: 'ch_forgotten_by_processor' });
    const res = await staff.post(`/api/admin/orders/${o.id}/refund`, { amountCents: 100 });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('processor_refused');
    expect((await t.deps.db('shop_orders').where('id', o.id).first()).refunded_cents).toBe(0);
  });

  it('answers 409 for an order paid outside the processor', async () => {
    const shirt = await openShirt(staff);
    const o = await order(shirt.variants[0].id);
    await t.deps.db('shop_orders').where('id', o.id).update({ charge_id: null, paid_outside_processor: true });
    const res = await staff.post(`/api/admin/orders/${o.id}/refund`, { amountCents: 100 });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/not paid by card through the processor/);
  });
});

describe('GET /api/admin/orders', () => {
  it('pages, sorts, filters by run and status, searches, and exports CSV with risky cells neutralised', async () => {
    const shirt = await openShirt(staff);
    const risky = `=cmd-${Date.now()}@example.test`.replace('=', 'x');
    const a = await order(shirt.variants[0].id, 1, risky);
    const b = await order(shirt.variants[1].id, 3);
    await t.deps.db('shop_orders').where('id', b.id).update({ ship_name: '=HYPERLINK("x")' });
    const page = await staff.get(`/api/admin/orders?runId=${shirt.run.id}&sort=total&dir=asc&pageSize=1`);
    expect(page.body.total).toBe(2);
    expect(page.body.items.map((o: { id: number }) => o.id)).toEqual([a.id]);
    const second = await staff.get(`/api/admin/orders?runId=${shirt.run.id}&sort=total&dir=asc&pageSize=1&page=2`);
    expect(second.body.items.map((o: { id: number }) => o.id)).toEqual([b.id]);
    expect(
      (await staff.get(`/api/admin/orders?q=${encodeURIComponent(a.number)}`)).body.items.map(
        (o: { id: number }) => o.id,
      ),
    ).toEqual([a.id]);
    expect((await staff.get(`/api/admin/orders?runId=${shirt.run.id}&status=shipped`)).body.total).toBe(0);
    expect((await staff.get('/api/admin/orders?sort=nonsense')).status).toBe(400);
    const csv = await staff.get(`/api/admin/orders/export?runId=${shirt.run.id}`);
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    // OWASP "CSV Injection": a cell beginning with = is prefixed with a quote.
    expect(csv.text).toContain(`"'=HYPERLINK(""x"")"`);
    expect(csv.text.split('\r\n')[0]).toBe(
      '\uFEFFOrder number,Placed at (America/Winnipeg),Status,E-mail,Ship to,Country,Shipping method,Units,Subtotal (CAD),Discount (CAD),Shipping (CAD),Tax (CAD),Total (CAD),Refunded (CAD),Carrier,Tracking number',
    );
  });
});

describe('GET /api/admin/runs/:id/print-sheet', () => {
  it('previews paid units plus spares, packs and the minimum while open, final once closed', async () => {
    const shirt = await openShirt(staff, { cap: 100 });
    for (let i = 0; i < 3; i++) await order(shirt.variants[0].id, 5);
    await order(shirt.variants[1].id, 1);
    const sheet = await staff.get(`/api/admin/runs/${shirt.run.id}/print-sheet`);
    expect(sheet.body.kind).toBe('preview');
    // Defaults: spares 5% up, packs of 6, 12 a design (common practice, no source). M: 15 + 1 = 16 -> 18; L: 1 + 1 = 2 -> 6.
    expect(
      sheet.body.lines.map((l: { paid: number; spares: number; toPrint: number }) => [l.paid, l.spares, l.toPrint]),
    ).toEqual([
      [15, 1, 18],
      [1, 1, 6],
    ]);
    expect(sheet.body).toMatchObject({
      totalPaid: 16,
      totalToPrint: 24,
      unitCostCents: 900,
      estimatedCostCents: 21600,
    });
    expect((await staff.post(`/api/admin/runs/${shirt.run.id}/state`, { state: 'shipped' })).status).toBe(409);
    expect((await staff.post(`/api/admin/runs/${shirt.run.id}/state`, { state: 'closed' })).body.run.state).toBe(
      'closed',
    );
    expect((await staff.get(`/api/admin/runs/${shirt.run.id}/print-sheet`)).body.kind).toBe('final');
    const csv = await staff.get(`/api/admin/runs/${shirt.run.id}/print-sheet.csv`);
    expect(csv.text).toContain(',Total,16,,24');
    const c = new Client(t.app);
    const closed = await c.post('/api/checkout/quote', {
      items: [{ variantId: shirt.variants[0].id, quantity: 1 }],
      shipTo: MB_ADDRESS,
      shippingMethodId: await methodId(c, 'canada'),
    });
    expect(closed.status).toBe(409);
    expect(closed.body.error.fields['items.0.quantity']).toMatch(/closed/);
  });
});

describe('POST /api/admin/runs', () => {
  const inDays = (d: number) => new Date(Date.now() + d * 86400_000).toISOString();

  it('adds a product’s next run once the last one is over; buyers then order from the new run', async () => {
    const shirt = await openShirt(staff, { cap: 20 });
    await order(shirt.variants[0].id, 2);
    const next = {
      productId: shirt.id,
      name: 'Season two',
      cap: 3,
      opensAt: inDays(-0.01),
      closesAt: inDays(5),
      unitCostCents: 850,
      variantCaps: [{ variantId: shirt.variants[0].id, cap: 1 }],
    };

    const early = await staff.post('/api/admin/runs', next);
    expect(early.status).toBe(409);
    expect(early.body.error).toMatchObject({ code: 'run_not_over', fields: { productId: expect.any(String) } });
    expect((await staff.post(`/api/admin/runs/${shirt.run.id}/state`, { state: 'closed' })).status).toBe(200);

    const backwards = await staff.post('/api/admin/runs', { ...next, closesAt: inDays(-1) });
    expect(backwards.status).toBe(400);
    expect(backwards.body.error.fields.closesAt).toMatch(/after the opening/);
    const beforeLast = await staff.post('/api/admin/runs', { ...next, opensAt: inDays(-3) });
    expect(beforeLast.status).toBe(400);
    expect(beforeLast.body.error.fields.opensAt).toMatch(/after the last run opened/);
    const sticker = await stockSticker(staff, 5);
    const foreign = await staff.post('/api/admin/runs', {
      ...next,
      variantCaps: [{ variantId: sticker.variants[0].id, cap: 1 }],
    });
    expect(foreign.status).toBe(400);
    expect(foreign.body.error.fields.variantCaps).toMatch(/not one of/);
    const fromStock = await staff.post('/api/admin/runs', { ...next, productId: sticker.id, variantCaps: [] });
    expect(fromStock.status).toBe(409);
    expect(fromStock.body.error.code).toBe('sold_from_stock');
    const missing = await staff.post('/api/admin/runs', { ...next, productId: 99999999 });
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields.productId).toBeDefined();
    const noCap = await staff.post('/api/admin/runs', { ...next, cap: 0 });
    expect(noCap.status).toBe(400);
    expect(noCap.body.error.fields.cap).toBeDefined();

    const made = await staff.post('/api/admin/runs', next);
    expect(made.status).toBe(201);
    expect(made.body.run).toMatchObject({ name: 'Season two', state: 'open', cap: 3, reserved: 0, unitCostCents: 850 });
    const shown = (await new Client(t.app).get(`/api/products/${shirt.slug}`)).body;
    expect(shown.run).toMatchObject({ id: made.body.run.id, state: 'open', cap: 3, remaining: 3 });
    expect(shown.variants.map((v: { remaining: number }) => v.remaining)).toEqual([1, 3]);

    await order(shirt.variants[0].id, 1);
    const c = new Client(t.app);
    const over = await c.post('/api/orders', {
      items: [{ variantId: shirt.variants[0].id, quantity: 1 }],
      shipTo: MB_ADDRESS,
      shippingMethodId: await methodId(c, 'canada'),
      email: 'late@example.test',
      paymentToken: 'tok_visa',
    });
    expect(over.status).toBe(409);
    expect(over.body.error.code).toBe('sold_out');
    const newSheet = (await staff.get(`/api/admin/runs/${made.body.run.id}/print-sheet`)).body;
    const oldSheet = (await staff.get(`/api/admin/runs/${shirt.run.id}/print-sheet`)).body;
    expect([newSheet.totalPaid, oldSheet.totalPaid]).toEqual([1, 2]);
  });

  it('lets only one of two staff add the next run at the same moment', async () => {
    const shirt = await openShirt(staff, { cap: 5 });
    await staff.post(`/api/admin/runs/${shirt.run.id}/state`, { state: 'closed' });
    const body = { productId: shirt.id, cap: 10, opensAt: inDays(1), closesAt: inDays(9) };
    const answers = await Promise.all([staff.post('/api/admin/runs', body), staff.post('/api/admin/runs', body)]);
    expect(answers.map((a) => a.status).sort()).toEqual([201, 409]);
    expect(
      (await staff.get('/api/admin/runs')).body.items.filter(
        (r: { productSlug: string }) => r.productSlug === shirt.slug,
      ),
    ).toHaveLength(2);
  });
});

describe('PUT /api/admin/shop/settings', () => {
  it('refuses a bad discount beside the field', async () => {
    const current = (await staff.get('/api/admin/shop/settings')).body.settings;
    const res = await staff.put('/api/admin/shop/settings', { ...current, memberDiscountPercent: 150 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.memberDiscountPercent).toMatch(/90/);
  });
});

describe('e-mail when SMTP is down', () => {
  it('keeps the confirmation queued and delivers it once when SMTP is back', async () => {
    const down = buildTestApp({ env: { SMTP_URL: 'smtp://127.0.0.1:9' } });
    try {
      const shirt = await openShirt(staff);
      const email = `smtp-${Date.now()}@example.test`;
      const c = new Client(down.app);
      const res = await c.post('/api/orders', {
        items: [{ variantId: shirt.variants[0].id, quantity: 1 }],
        shipTo: MB_ADDRESS,
        shippingMethodId: await methodId(c, 'canada'),
        email,
        paymentToken: 'tok_visa',
      });
      expect(res.status).toBe(201);
      expect(await down.deps.mail.deliverDue()).toBe(0);
      const row = await t.deps
        .db('outbound_emails')
        .where('dedupe_key', `shop-confirmation-${res.body.order.id}`)
        .first();
      expect(row.status).toBe('queued');
      expect(await emailsTo(email)).toHaveLength(0);
      await t.deps
        .db('outbound_emails')
        .where('id', row.id)
        .update({ next_attempt_at: new Date(0) });
      await t.deps.mail.deliverDue();
      await t.deps.mail.deliverDue();
      await waitForEmails(email, /thank you/);
      expect(await emailsTo(email)).toHaveLength(1);
    } finally {
      await down.close();
    }
  });
});
