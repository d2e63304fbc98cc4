import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { BooksRepository } from '../../server/books/books-repository';
import { BooksService } from '../../server/books/books-service';
import { recordMovement, type Movement } from '../../server/books/ledger-writer';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type Client } from '../helpers/users';

// Fixtures live in 2019 so other test files' movements (dated today or near it) never fall inside these ranges.
let t: TestApp;
let treasurer: Client;
const tag = randomUUID().slice(0, 6);

// Manitoba: GST 5% (CRA, "Charge and collect the tax – Which rate to charge"); RST 8% until 2019-06-30 and 7% from
// 2019-07-01 (Manitoba Finance, from memory). GST's jurisdiction is the place of supply, as the shop records it.
const mb = (taxable: number, rst: '8' | '7' = '8') => [
  {
    code: 'GST' as const,
    jurisdiction: 'MB',
    ratePercent: '5',
    taxableCents: taxable,
    taxCents: Math.round(taxable * 0.05),
  },
  {
    code: 'RST' as const,
    jurisdiction: 'MB',
    ratePercent: rst,
    taxableCents: taxable,
    taxCents: Math.round((taxable * Number(rst)) / 100),
  },
];
const on = (t: TestApp, m: Omit<Movement, 'reference' | 'counterparty' | 'method'> & Partial<Movement>) =>
  t.deps.db.transaction((trx) =>
    recordMovement(trx, { reference: `T-${tag}`, counterparty: 'Fixture Buyer', method: 'card', ...m }),
  );
const buyer = `books-fixture-${tag}@padside.test`;

beforeAll(async () => {
  t = buildTestApp();
  ({ client: treasurer } = await signedIn(t.app, t.deps.db, ['treasurer']));
  const db = t.deps.db;
  // The fixtures may already exist from an earlier run of this file on the same database: start clean.
  await db('money_movements')
    .where('occurred_at', '>=', '2019-01-01')
    .andWhere('occurred_at', '<', '2020-02-01')
    .delete();
  await db('shop_orders').where('paid_at', '>=', '2019-01-01').andWhere('paid_at', '<', '2020-02-01').delete();
  // February 2019: a C$100 shirt order to Manitoba, C$100 + GST 5.00 + RST 8.00 = C$113.00; fee 2.9% + 0.30 = 3.58
  // (Stripe Canadian standard pricing [2nd]).
  await on(t, {
    occurredAt: new Date('2019-02-10T18:00:00Z'),
    kind: 'order_payment',
    source: 'merch',
    grossCents: 11300,
    feeCents: 358,
    feeEstimated: true,
    taxes: mb(10000),
    processorChargeId: `ch_${tag}`,
  });
  // Last second of February in Winnipeg (CST, UTC-6): 2019-03-01T05:59:59Z. C$50 + 2.50 + 4.00.
  await on(t, {
    occurredAt: new Date('2019-03-01T05:59:59Z'),
    kind: 'order_payment',
    source: 'merch',
    grossCents: 5650,
    taxes: mb(5000),
  });
  // First second of March in Winnipeg. C$20 + 1.00 + 1.60.
  await on(t, {
    occurredAt: new Date('2019-03-01T06:00:00Z'),
    kind: 'order_payment',
    source: 'merch',
    grossCents: 2260,
    taxes: mb(2000),
  });
  // Partial refund in March of half the February shirt: -C$56.50 with its tax at the order's rates.
  await on(t, {
    occurredAt: new Date('2019-03-15T17:00:00Z'),
    kind: 'refund',
    source: 'merch',
    grossCents: -5650,
    taxes: mb(5000).map((x) => ({ ...x, taxableCents: -x.taxableCents, taxCents: -x.taxCents })),
  });
  // Dues in February, cash in March from a sponsor whose name would start a spreadsheet formula.
  await on(t, {
    occurredAt: new Date('2019-02-20T18:00:00Z'),
    kind: 'dues_payment',
    source: 'dues',
    grossCents: 4500,
    feeCents: 161,
    reference: 'M-0001',
    counterparty: 'Smith, "Jo"\nSecond line',
  });
  await on(t, {
    occurredAt: new Date('2019-03-20T18:00:00Z'),
    kind: 'sponsor_cash',
    source: 'sponsor',
    grossCents: 25000,
    method: 'e-transfer',
    counterparty: '=HYPERLINK("http://x.test")',
  });
  // Summer time (CDT, UTC-5) around the 1 July boundary: 23:30 on 30 June is 04:30Z, 00:30 on 1 July is 05:30Z.
  await on(t, {
    occurredAt: new Date('2019-07-01T04:30:00Z'),
    kind: 'order_payment',
    source: 'merch',
    grossCents: 1130,
    taxes: mb(1000, '8'),
  });
  await on(t, {
    occurredAt: new Date('2019-07-01T05:30:00Z'),
    kind: 'order_payment',
    source: 'merch',
    grossCents: 1120,
    taxes: mb(1000, '7'),
  });
  // May 2019: one paid order delivered to B.C., where the demo seller does not collect PST: C$32 + GST 1.60.
  await db('shop_orders').insert({
    email: buyer,
    status: 'paid',
    ship_name: 'Fixture Buyer',
    ship_country: 'CA',
    ship_province: 'BC',
    ship_postal_code: 'V5K 0A1',
    shipping_code: 'pickup',
    shipping_name: 'Fixture',
    tax_jurisdiction: 'BC',
    priced_on: '2019-05-10',
    weight_grams: 190,
    subtotal_cents: 3200,
    discount_cents: 0,
    shipping_cents: 0,
    tax_cents: 160,
    total_cents: 3360,
    paid_at: new Date('2019-05-10T18:00:00Z'),
  });
});
afterAll(async () => {
  await t.deps.db('shop_orders').where('email', buyer).delete();
  await t.close();
});

type Line = { code: string; taxableCents: number; taxCents: number };
const find = (lines: Line[], code: string): Line => lines.find((l) => l.code === code)!;

describe('GET /api/admin/reports/tax', () => {
  it('reports per authority and per tax and jurisdiction: taxable sales net of refunds, collected, refunded, net', async () => {
    const feb = await treasurer.get('/api/admin/reports/tax?from=2019-02-01&to=2019-02-28');
    expect(feb.status).toBe(200);
    // The demo seller's position (shop settings defaults): Manitoba, GST/HST registered, collecting Manitoba RST.
    expect(feb.body.registrations).toMatchObject({
      sellerProvince: 'MB',
      gstHstRegistered: true,
      provincialRegistrations: ['MB'],
    });
    expect(feb.body.authorities).toEqual([
      {
        authority: 'CA',
        name: 'Canada Revenue Agency',
        lines: [
          { code: 'GST', jurisdiction: 'MB', taxableCents: 15000, taxCents: 750, refundedCents: 0, netCents: 750 },
        ],
        totals: { taxableCents: 15000, taxCents: 750, refundedCents: 0, netCents: 750 },
      },
      {
        authority: 'MB',
        name: 'Manitoba Finance',
        lines: [
          { code: 'RST', jurisdiction: 'MB', taxableCents: 15000, taxCents: 1200, refundedCents: 0, netCents: 1200 },
        ],
        totals: { taxableCents: 15000, taxCents: 1200, refundedCents: 0, netCents: 1200 },
      },
    ]);
    // Refunds count in the period they are made: March gives back more tax than it collects.
    const mar = await treasurer.get('/api/admin/reports/tax?from=2019-03-01&to=2019-03-31');
    expect(mar.body.lines).toEqual([
      { code: 'GST', jurisdiction: 'MB', taxableCents: -3000, taxCents: 100, refundedCents: 250, netCents: -150 },
      { code: 'RST', jurisdiction: 'MB', taxableCents: -3000, taxCents: 160, refundedCents: 400, netCents: -240 },
    ]);
    expect(
      mar.body.authorities.map((a: { authority: string; totals: { netCents: number } }) => [
        a.authority,
        a.totals.netCents,
      ]),
    ).toEqual([
      ['CA', -150],
      ['MB', -240],
    ]);
  });

  it('puts an instant in the club’s day, not UTC’s (midnight boundary in America/Winnipeg, winter time)', async () => {
    const lastDay = await treasurer.get('/api/admin/reports/tax?from=2019-02-28&to=2019-02-28');
    expect(find(lastDay.body.lines, 'GST').taxableCents).toBe(5000);
    const firstDay = await treasurer.get('/api/admin/reports/tax?from=2019-03-01&to=2019-03-01');
    expect(find(firstDay.body.lines, 'GST').taxableCents).toBe(2000);
  });

  it('puts a sale at 00:30 on 1 July (summer time, UTC-5) in July, and one at 23:30 on 30 June in June', async () => {
    const june = await treasurer.get('/api/admin/reports/tax?from=2019-06-01&to=2019-06-30');
    // RST 8% until 2019-06-30, 7% from 2019-07-01 (Manitoba Finance, from memory).
    expect(june.body.lines).toEqual([
      { code: 'GST', jurisdiction: 'MB', taxableCents: 1000, taxCents: 50, refundedCents: 0, netCents: 50 },
      { code: 'RST', jurisdiction: 'MB', taxableCents: 1000, taxCents: 80, refundedCents: 0, netCents: 80 },
    ]);
    const july = await treasurer.get('/api/admin/reports/tax?from=2019-07-01&to=2019-07-31');
    expect(find(july.body.lines, 'RST')).toMatchObject({ taxableCents: 1000, taxCents: 70 });
    const revenue = await treasurer.get('/api/admin/reports/revenue?from=2019-06-01&to=2019-07-31');
    expect(
      revenue.body.rows.map((r: { month: string; grossCents: number; incomeCents: number }) => [
        r.month,
        r.grossCents,
        r.incomeCents,
      ]),
    ).toEqual([
      ['2019-06', 1130, 1000],
      ['2019-07', 1120, 1000],
    ]);
  });

  it('notes sales into a province whose own sales tax the seller does not collect, with thresholds from memory', async () => {
    const may = await treasurer.get('/api/admin/reports/tax?from=2019-05-01&to=2019-05-31');
    expect(may.body.unregisteredProvinces).toEqual([
      { province: 'BC', tax: 'PST', orders: 1, salesCents: 3200, threshold: expect.stringMatching(/^from memory/) },
    ]);
    // Manitoba, where the demo seller is registered, is never noted.
    const feb = await treasurer.get('/api/admin/reports/tax?from=2019-02-01&to=2019-02-28');
    expect(feb.body.unregisteredProvinces).toEqual([]);
  });

  it('answers 400 for a bad or inverted range, and 403 for a fan', async () => {
    expect((await treasurer.get('/api/admin/reports/tax?from=2019-02-30&to=2019-03-01')).status).toBe(400);
    const inverted = await treasurer.get('/api/admin/reports/tax?from=2019-03-02&to=2019-03-01');
    expect(inverted.status).toBe(400);
    expect(inverted.body.error.fields.to).toBeDefined();
    expect((await treasurer.get('/api/admin/reports/tax')).status).toBe(400);
    const { client: fan } = await signedIn(t.app, t.deps.db, ['fan']);
    expect((await fan.get('/api/admin/reports/tax?from=2019-02-01&to=2019-02-28')).status).toBe(403);
    expect((await request(t.app).get('/api/admin/reports/tax?from=2019-02-01&to=2019-02-28')).status).toBe(401);
  });

  it('exports the same lines as CSV, each with its authority', async () => {
    const res = await treasurer.get('/api/admin/reports/tax.csv?from=2019-03-01&to=2019-03-31');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    expect(res.text).toBe(
      '\uFEFFTax authority,Tax,Jurisdiction,Taxable sales net of refunds (CAD),Tax collected (CAD),Tax refunded (CAD),Net tax collected (CAD)\r\n' +
        'Canada Revenue Agency,GST,MB,-30.00,1.00,2.50,-1.50\r\nManitoba Finance,RST,MB,-30.00,1.60,4.00,-2.40\r\n',
    );
  });
});

describe('GET /api/admin/reports/revenue', () => {
  it('splits gross, tax collected, income net of tax, refunds net of tax, fees and net by month and source', async () => {
    const res = await treasurer.get('/api/admin/reports/revenue?from=2019-02-01&to=2019-03-31');
    expect(res.status).toBe(200);
    expect(res.body.rows).toEqual([
      {
        month: '2019-02',
        source: 'dues',
        grossCents: 4500,
        taxCents: 0,
        incomeCents: 4500,
        refundsCents: 0,
        refundedTaxCents: 0,
        refundsNetCents: 0,
        feesCents: 161,
        netCents: 4339,
      },
      {
        month: '2019-02',
        source: 'merch',
        grossCents: 16950,
        taxCents: 1950,
        incomeCents: 15000,
        refundsCents: 0,
        refundedTaxCents: 0,
        refundsNetCents: 0,
        feesCents: 358,
        netCents: 14642,
      },
      {
        month: '2019-03',
        source: 'merch',
        grossCents: 2260,
        taxCents: 260,
        incomeCents: 2000,
        refundsCents: 5650,
        refundedTaxCents: 650,
        refundsNetCents: 5000,
        feesCents: 0,
        netCents: -3000,
      },
      {
        month: '2019-03',
        source: 'sponsor',
        grossCents: 25000,
        taxCents: 0,
        incomeCents: 25000,
        refundsCents: 0,
        refundedTaxCents: 0,
        refundsNetCents: 0,
        feesCents: 0,
        netCents: 25000,
      },
    ]);
    expect(res.body.totals).toEqual({
      grossCents: 48710,
      taxCents: 2210,
      incomeCents: 46500,
      refundsCents: 5650,
      refundedTaxCents: 650,
      refundsNetCents: 5000,
      feesCents: 519,
      netCents: 40981,
    });
  });
});

describe('GET /api/admin/reports/ledger.csv', () => {
  it('has one row per movement, with quoting and formula cells neutralised (OWASP "CSV Injection")', async () => {
    const res = await treasurer.get('/api/admin/reports/ledger.csv?from=2019-02-01&to=2019-03-31');
    expect(res.status).toBe(200);
    const lines = res.text.split('\r\n');
    expect(lines[0]).toBe(
      '\uFEFFDate (America/Winnipeg),Kind,Source,Reference,Counterparty,Method,Gross (CAD),GST (CAD),HST (CAD),PST (CAD),QST (CAD),RST (CAD),Fee (CAD),Fee estimated,Net (CAD)',
    );
    expect(lines).toContain(
      `2019-02-10,Order payment,Merch,T-${tag},Fixture Buyer,Card,113.00,5.00,,,,8.00,3.58,Yes,109.42`,
    );
    expect(lines).toContain(
      `2019-02-28,Order payment,Merch,T-${tag},Fixture Buyer,Card,56.50,2.50,,,,4.00,0.00,No,56.50`,
    );
    expect(lines).toContain(`2019-03-15,Refund,Merch,T-${tag},Fixture Buyer,Card,-56.50,-2.50,,,,-4.00,0.00,No,-56.50`);
    expect(res.text).toContain(
      `2019-02-20,Dues payment,Dues,M-0001,"Smith, ""Jo""\nSecond line",Card,45.00,,,,,,1.61,No,43.39`,
    );
    expect(res.text).toContain(
      `2019-03-20,Sponsor cash,Sponsor cash,T-${tag},"'=HYPERLINK(""http://x.test"")",E-transfer,250.00`,
    );
    const dates = lines.filter((l) => l.startsWith('2019-')).map((l) => l.slice(0, 10));
    expect(dates).toEqual([...dates].sort());
    expect(lines.filter((l) => l.startsWith('2019-')).length).toBe(6);
  });
});

describe('actual processor fees', () => {
  it('replace the estimate for the charge', async () => {
    expect(
      await t.app.platform.deps
        .db('money_movements')
        .where({ processor_charge_id: `ch_${tag}` })
        .first('fee_estimated'),
    ).toEqual({ fee_estimated: true });
    const repo = new BooksRepository(t.deps.db, 'America/Winnipeg');
    const updated = await t.deps.db.transaction((trx) => repo.setActualFee(trx, `ch_${tag}`, 348));
    expect(updated).toBe(1);
    const row = await t.deps
      .db('money_movements')
      .where({ processor_charge_id: `ch_${tag}` })
      .first('fee_cents', 'fee_estimated');
    expect(row).toEqual({ fee_cents: 348, fee_estimated: false });
    await t.deps
      .db('money_movements')
      .where({ processor_charge_id: `ch_${tag}` })
      .update({ fee_cents: 358, fee_estimated: true });
  });
});

describe('PUT /api/admin/settings/processor-fees', () => {
  it('reads the estimate as percentages and refuses a bad one beside its field', async () => {
    const before = (await treasurer.get('/api/admin/settings/processor-fees')).body;
    // Stored as 290 and 80 basis points: 2.9 % and 0.8 %.
    expect(before).toEqual({ percent: 2.9, fixedCents: 30, internationalExtraPercent: 0.8 });
    const negative = await treasurer.put('/api/admin/settings/processor-fees', { ...before, percent: -1 });
    expect(negative.status).toBe(400);
    expect(negative.body.error.fields.percent).toBe('At least 0 %.');
    const tooFine = await treasurer.put('/api/admin/settings/processor-fees', {
      ...before,
      internationalExtraPercent: 0.125,
    });
    expect(tooFine.status).toBe(400);
    expect(tooFine.body.error.fields.internationalExtraPercent).toMatch(/two decimals/);
    // Suites share the club-wide setting, so the stored value is only written back as it was.
    const same = await treasurer.put('/api/admin/settings/processor-fees', before);
    expect(same.body).toEqual(before);
    const stored = await t.deps.db('settings').where({ key: 'processor_fees' }).first('value');
    expect(stored.value).toEqual({ percentBasisPoints: 290, fixedCents: 30, internationalExtraBasisPoints: 80 });
  });
});

describe('the actual-fee job', () => {
  it('replaces an estimate with the fee the processor reports, and keeps it when the processor knows none', async () => {
    const job = t.app.jobs.find((j) => j.name === 'books-actual-fees')!;
    const gateway = t.deps.payments;
    const original = gateway.actualFeeCents.bind(gateway);
    // The local fake has no balance transactions, so this test plays the processor: a fee for this file's charge and
    // none yet for the other files' charges, which stay estimated and come before it.
    gateway.actualFeeCents = async (chargeId: string) => (chargeId === `ch_${tag}` ? 341 : null);
    try {
      await job.run();
      const row = await t.deps
        .db('money_movements')
        .where({ processor_charge_id: `ch_${tag}` })
        .first('fee_cents', 'fee_estimated');
      expect(row).toEqual({ fee_cents: 341, fee_estimated: false });
    } finally {
      gateway.actualFeeCents = original;
      await t.deps
        .db('money_movements')
        .where({ processor_charge_id: `ch_${tag}` })
        .update({ fee_cents: 358, fee_estimated: true });
    }
  });

  it('pages past charges the processor has no fee for yet', async () => {
    const later = `ch_${tag}_later`;
    await on(t, {
      occurredAt: new Date('2019-02-11T18:00:00Z'),
      kind: 'order_payment',
      source: 'merch',
      grossCents: 2260,
      feeCents: 96,
      feeEstimated: true,
      taxes: mb(2000),
      processorChargeId: later,
    });
    const books = new BooksService(
      t.deps.db,
      new BooksRepository(t.deps.db, 'America/Winnipeg'),
      t.app.platform.settings,
      t.deps.calendar,
      () => ({}),
    );
    const fees: Record<string, number> = { [`ch_${tag}`]: 341, [later]: 95 };
    // One charge a page: before paging, a run stopped after the oldest estimate, whatever the processor said.
    const updated = await books.syncActualFees({ actualFeeCents: async (id) => fees[id] ?? null }, 1);
    expect(updated).toBe(2);
    const rows = await t.deps
      .db('money_movements')
      .whereIn('processor_charge_id', Object.keys(fees))
      .orderBy('id')
      .select('fee_cents', 'fee_estimated');
    expect(rows).toEqual([
      { fee_cents: 341, fee_estimated: false },
      { fee_cents: 95, fee_estimated: false },
    ]);
    await t.deps
      .db('money_movements')
      .where({ processor_charge_id: `ch_${tag}` })
      .update({ fee_cents: 358, fee_estimated: true });
  });
});
