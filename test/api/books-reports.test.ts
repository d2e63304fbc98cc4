import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { recordMovement, type Movement } from '../../server/books/ledger-writer';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type Client } from '../helpers/users';

// Fixtures live in 2019 so other test files' movements (dated today or near it) never fall inside these ranges.
let t: TestApp;
let treasurer: Client;
const tag = randomUUID().slice(0, 6);

const mb = (taxable: number) => [
  // Manitoba: GST 5% (CRA, "Charge and collect the tax – Which rate to charge"); RST 7% (Manitoba Finance, "Retail Sales Tax").
  { code: 'GST' as const, jurisdiction: 'CA', ratePercent: '5', taxableCents: taxable, taxCents: Math.round(taxable * 0.05) },
  { code: 'RST' as const, jurisdiction: 'MB', ratePercent: '7', taxableCents: taxable, taxCents: Math.round(taxable * 0.07) },
];
const on = (t: TestApp, m: Omit<Movement, 'reference' | 'counterparty' | 'method'> & Partial<Movement>) =>
  t.deps.db.transaction((trx) => recordMovement(trx, { reference: `T-${tag}`, counterparty: 'Fixture Buyer', method: 'card', ...m }));

beforeAll(async () => {
  t = buildTestApp();
  ({ client: treasurer } = await signedIn(t.app, t.deps.db, ['treasurer']));
  const db = t.deps.db;
  // The fixtures may already exist from an earlier run of this file on the same database: start clean.
  await db('money_movements').where('occurred_at', '>=', '2019-01-01').andWhere('occurred_at', '<', '2020-02-01').delete();
  // February 2019: a C$100 shirt order to Manitoba, C$100 + GST 5.00 + RST 7.00 = C$112.00; fee 2.9% + 0.30 = 3.55.
  await on(t, { occurredAt: new Date('2019-02-10T18:00:00Z'), kind: 'order_payment', source: 'merch', grossCents: 11200, feeCents: 355, feeEstimated: true, taxes: mb(10000), processorChargeId: `ch_${tag}` });
  // Last second of February in Winnipeg (CST, UTC-6): 2019-03-01T05:59:59Z.
  await on(t, { occurredAt: new Date('2019-03-01T05:59:59Z'), kind: 'order_payment', source: 'merch', grossCents: 5600, taxes: mb(5000) });
  // First second of March in Winnipeg.
  await on(t, { occurredAt: new Date('2019-03-01T06:00:00Z'), kind: 'order_payment', source: 'merch', grossCents: 2240, taxes: mb(2000) });
  // Partial refund in March of half the February shirt: -C$56.00 with its tax.
  await on(t, { occurredAt: new Date('2019-03-15T17:00:00Z'), kind: 'refund', source: 'merch', grossCents: -5600, taxes: mb(5000).map((x) => ({ ...x, taxableCents: -x.taxableCents, taxCents: -x.taxCents })) });
  // Dues in February, cash in March from a sponsor whose name would start a spreadsheet formula.
  await on(t, { occurredAt: new Date('2019-02-20T18:00:00Z'), kind: 'dues_payment', source: 'dues', grossCents: 4500, feeCents: 161, reference: 'M-0001', counterparty: 'Smith, "Jo"\nSecond line' });
  await on(t, { occurredAt: new Date('2019-03-20T18:00:00Z'), kind: 'sponsor_cash', source: 'sponsor', grossCents: 25000, method: 'e-transfer', counterparty: '=HYPERLINK("http://x.test")' });
});
afterAll(() => t.close());

describe('GET /api/admin/reports/tax', () => {
  it('sums tax charged and refunded per kind and jurisdiction, refunds in the period they happen', async () => {
    const feb = await treasurer.get('/api/admin/reports/tax?from=2019-02-01&to=2019-02-28');
    expect(feb.status).toBe(200);
    // The demo seller's position (shop settings defaults): Manitoba, GST/HST registered, collecting Manitoba RST.
    expect(feb.body.registrations).toMatchObject({ sellerProvince: 'MB', gstHstRegistered: true, provincialRegistrations: ['MB'] });
    expect(feb.body.lines).toEqual([
      { code: 'GST', jurisdiction: 'CA', taxableCents: 15000, taxCents: 750, refundedCents: 0, netCents: 750 },
      { code: 'RST', jurisdiction: 'MB', taxableCents: 15000, taxCents: 1050, refundedCents: 0, netCents: 1050 },
    ]);
    const mar = await treasurer.get('/api/admin/reports/tax?from=2019-03-01&to=2019-03-31');
    expect(mar.body.lines).toEqual([
      { code: 'GST', jurisdiction: 'CA', taxableCents: 2000, taxCents: 100, refundedCents: 250, netCents: -150 },
      { code: 'RST', jurisdiction: 'MB', taxableCents: 2000, taxCents: 140, refundedCents: 350, netCents: -210 },
    ]);
  });

  it('puts an instant in the club’s day, not UTC’s (midnight boundary in America/Winnipeg)', async () => {
    const lastDay = await treasurer.get('/api/admin/reports/tax?from=2019-02-28&to=2019-02-28');
    expect(lastDay.body.lines.find((l: { code: string }) => l.code === 'GST').taxableCents).toBe(5000);
    const firstDay = await treasurer.get('/api/admin/reports/tax?from=2019-03-01&to=2019-03-01');
    expect(firstDay.body.lines.find((l: { code: string }) => l.code === 'GST').taxableCents).toBe(2000);
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

  it('exports the same lines as CSV', async () => {
    const res = await treasurer.get('/api/admin/reports/tax.csv?from=2019-03-01&to=2019-03-31');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    expect(res.text).toBe('tax,jurisdiction,taxable_sales,tax_charged,tax_refunded,net_owed\r\nGST,CA,20.00,1.00,2.50,-1.50\r\nRST,MB,20.00,1.40,3.50,-2.10\r\n');
  });
});

describe('GET /api/admin/reports/revenue', () => {
  it('splits gross, refunds, fees and net by month and source', async () => {
    const res = await treasurer.get('/api/admin/reports/revenue?from=2019-02-01&to=2019-03-31');
    expect(res.status).toBe(200);
    expect(res.body.rows).toEqual([
      { month: '2019-02', source: 'dues', grossCents: 4500, refundsCents: 0, feesCents: 161, netCents: 4339 },
      { month: '2019-02', source: 'merch', grossCents: 16800, refundsCents: 0, feesCents: 355, netCents: 16445 },
      { month: '2019-03', source: 'merch', grossCents: 2240, refundsCents: 5600, feesCents: 0, netCents: -3360 },
      { month: '2019-03', source: 'sponsor', grossCents: 25000, refundsCents: 0, feesCents: 0, netCents: 25000 },
    ]);
  });
});

describe('GET /api/admin/reports/ledger.csv', () => {
  it('has one row per movement, with quoting and formula cells neutralised (OWASP "CSV Injection")', async () => {
    const res = await treasurer.get('/api/admin/reports/ledger.csv?from=2019-02-01&to=2019-03-31');
    expect(res.status).toBe(200);
    const lines = res.text.split('\r\n');
    expect(lines[0]).toBe('date,kind,source,reference,counterparty,method,gross,gst,hst,pst,qst,rst,fee,fee_estimated,net');
    expect(lines).toContain(`2019-02-10,order_payment,merch,T-${tag},Fixture Buyer,card,112.00,5.00,,,,7.00,3.55,yes,108.45`);
    expect(lines).toContain(`2019-02-28,order_payment,merch,T-${tag},Fixture Buyer,card,56.00,2.50,,,,3.50,0.00,no,56.00`);
    expect(lines).toContain(`2019-03-15,refund,merch,T-${tag},Fixture Buyer,card,-56.00,-2.50,,,,-3.50,0.00,no,-56.00`);
    expect(res.text).toContain(`2019-02-20,dues_payment,dues,M-0001,"Smith, ""Jo""\nSecond line",card,45.00,,,,,,1.61,no,43.39`);
    expect(res.text).toContain(`2019-03-20,sponsor_cash,sponsor,T-${tag},"'=HYPERLINK(""http://x.test"")",e-transfer,250.00`);
    expect(lines.filter((l) => l.startsWith('2019-')).length).toBe(6);
  });
});

describe('actual processor fees', () => {
  it('replace the estimate for the charge', async () => {
    expect(await t.app.platform.deps.db('money_movements').where({ processor_charge_id: `ch_${tag}` }).first('fee_estimated')).toEqual({ fee_estimated: true });
    const books = (await import('../../server/books/books-repository')).BooksRepository;
    const updated = await new books(t.deps.db, 'America/Winnipeg').setActualFee(`ch_${tag}`, 348);
    expect(updated).toBe(1);
    const row = await t.deps.db('money_movements').where({ processor_charge_id: `ch_${tag}` }).first('fee_cents', 'fee_estimated');
    expect(row).toEqual({ fee_cents: '348', fee_estimated: false });
    await t.deps.db('money_movements').where({ processor_charge_id: `ch_${tag}` }).update({ fee_cents: 355, fee_estimated: true });
  });
});

describe('PUT /api/admin/settings/processor-fees', () => {
  it('stores a new estimate rule and refuses a bad one', async () => {
    const before = (await treasurer.get('/api/admin/settings/processor-fees')).body;
    expect(before).toEqual({ percentBasisPoints: 290, fixedCents: 30, internationalExtraBasisPoints: 80 });
    const bad = await treasurer.put('/api/admin/settings/processor-fees', { percentBasisPoints: -1, fixedCents: 30, internationalExtraBasisPoints: 80 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.percentBasisPoints).toBeDefined();
  });
});

describe('the actual-fee job', () => {
  it('replaces an estimate with the fee the processor reports, and keeps it when the processor knows none', async () => {
    const job = t.app.jobs.find((j) => j.name === 'books-actual-fees')!;
    const gateway = t.deps.payments;
    const original = gateway.actualFeeCents.bind(gateway);
    // The local fake has no balance transactions, so this test plays the processor's answer for one charge.
    gateway.actualFeeCents = async (chargeId: string) => (chargeId === `ch_${tag}` ? 341 : original(chargeId));
    try {
      await job.run();
      const row = await t.deps.db('money_movements').where({ processor_charge_id: `ch_${tag}` }).first('fee_cents', 'fee_estimated');
      expect(row).toEqual({ fee_cents: '341', fee_estimated: false });
    } finally {
      gateway.actualFeeCents = original;
      await t.deps.db('money_movements').where({ processor_charge_id: `ch_${tag}` }).update({ fee_cents: 355, fee_estimated: true });
    }
  });
});
