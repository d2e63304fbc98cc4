import { randomUUID } from 'node:crypto';
import { buildTestApp, fixedClock, type TestApp } from '../helpers/test-app';
import { signedIn, type Client } from '../helpers/users';

// March 2033: no other suite records money then, so the month's tax report is this file's alone.
let t: TestApp;
let treasurer: Client;
const tag = randomUUID().slice(0, 6);

beforeAll(async () => {
  t = buildTestApp({ clock: fixedClock('2033-03-10T18:00:00Z') });
  treasurer = (await signedIn(t.app, t.deps.db, ['fan', 'treasurer'])).client;
  await t.deps
    .db('money_movements')
    .where('occurred_at', '>=', '2033-03-01')
    .andWhere('occurred_at', '<', '2033-04-02')
    .delete();
});
afterAll(() => t.close());

async function agreement(name: string, body: object) {
  const created = await treasurer.post('/api/admin/sponsors', {
    name: `${name} ${tag}`,
    website: 'https://example.test',
    blurb: 'Invented for a test.',
  });
  expect(created.status).toBe(201);
  const res = await treasurer.post(`/api/admin/sponsors/${created.body.id}/agreements`, {
    season: '2033',
    deliverables: [{ kind: 'video_mention', quantity: 2, dueOn: '2033-09-30' }],
    ...body,
  });
  return { sponsorId: created.body.id as number, res };
}

describe('sponsor agreements taxed as promotion or gift', () => {
  it('charges HST at the sponsor’s province on promotion, none on a gift, and both land in the tax report and income', async () => {
    const promo = await agreement('Promo Rocket Parts', {
      cashCents: 100_000,
      taxTreatment: 'promotion',
      taxProvince: 'ON',
    });
    expect(promo.res.status).toBe(201);
    const gift = await agreement('Quiet Gift Co', { cashCents: 50_000 });
    expect(gift.res.status).toBe(201);
    const ledger = (await treasurer.get(`/api/admin/sponsors/${promo.sponsorId}/ledger`)).body.agreements[0];
    expect(ledger).toMatchObject({ taxTreatment: 'promotion', taxProvince: 'ON' });
    expect((await treasurer.get(`/api/admin/sponsors/${gift.sponsorId}/ledger`)).body.agreements[0]).toMatchObject({
      taxTreatment: 'gift',
      taxProvince: null,
    });

    expect(
      (
        await treasurer.post(`/api/admin/sponsors/agreements/${promo.res.body.id}/cash-received`, {
          receivedOn: '2033-03-10',
          method: 'cheque',
        })
      ).status,
    ).toBe(201);
    expect(
      (
        await treasurer.post(`/api/admin/sponsors/agreements/${gift.res.body.id}/cash-received`, {
          receivedOn: '2033-03-10',
          method: 'cheque',
        })
      ).status,
    ).toBe(201);
    // C$1,000 of promotion to an Ontario sponsor: HST 13% = C$130.00 (CRA rate page: ON 13%); the sponsor pays C$1,130.
    const mv = await t.deps
      .db('money_movements')
      .where({ kind: 'sponsor_cash', reference: String(promo.res.body.id) })
      .first();
    expect(Number(mv.gross_cents)).toBe(113_000);
    const tax = await t.deps.db('money_movement_taxes').where({ movement_id: mv.id });
    expect(tax.map((x) => [x.code, x.jurisdiction, Number(x.taxable_cents), Number(x.tax_cents)])).toEqual([
      ['HST', 'ON', 100_000, 13_000],
    ]);

    const report = await treasurer.get('/api/admin/reports/tax?from=2033-03-01&to=2033-03-31');
    expect(report.body.authorities).toEqual([
      {
        authority: 'CA',
        name: 'Canada Revenue Agency',
        lines: [
          {
            code: 'HST',
            jurisdiction: 'ON',
            taxableCents: 100_000,
            taxCents: 13_000,
            refundedCents: 0,
            netCents: 13_000,
          },
        ],
        totals: { taxableCents: 100_000, taxCents: 13_000, refundedCents: 0, netCents: 13_000 },
      },
    ]);
    const income = await treasurer.get('/api/admin/reports/revenue?from=2033-03-01&to=2033-03-31');
    expect(income.body.rows).toEqual([
      expect.objectContaining({
        source: 'sponsor',
        grossCents: 163_000,
        taxCents: 13_000,
        incomeCents: 150_000,
        netCents: 150_000,
      }),
    ]);
  });

  it('charges GST only for a Manitoba sponsor (CRA rate page: 5%; no RST on the promotion)', async () => {
    const mb = await agreement('Promoozle Promo', { cashCents: 20_000, taxTreatment: 'promotion', taxProvince: 'MB' });
    await treasurer.post(`/api/admin/sponsors/agreements/${mb.res.body.id}/cash-received`, {
      receivedOn: '2033-03-10',
      method: 'cash',
    });
    const mv = await t.deps
      .db('money_movements')
      .where({ kind: 'sponsor_cash', reference: String(mb.res.body.id) })
      .first();
    expect(Number(mv.gross_cents)).toBe(21_000);
  });

  it('refuses promotion without the sponsor’s province (400 naming the field)', async () => {
    const { res } = await agreement('No Province Co', { cashCents: 10_000, taxTreatment: 'promotion' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['taxProvince']);
  });
});

describe('PUT /api/admin/sponsors/agreements/:agreementId/tax-treatment', () => {
  it('switches a gift to promotion, refuses it without a province, and refuses any change after the cash is in (409)', async () => {
    const { res } = await agreement('Switch Co', { cashCents: 30_000 });
    const url = `/api/admin/sponsors/agreements/${res.body.id}/tax-treatment`;
    const missing = await treasurer.put(url, { taxTreatment: 'promotion' });
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields).toHaveProperty('province');
    const bad = await treasurer.put(url, { taxTreatment: 'barter' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('taxTreatment');
    const ok = await treasurer.put(url, { taxTreatment: 'promotion', province: 'SK' });
    expect(ok.status).toBe(200);
    expect(ok.body).toEqual({ taxTreatment: 'promotion', taxProvince: 'SK' });
    await treasurer.post(`/api/admin/sponsors/agreements/${res.body.id}/cash-received`, {
      receivedOn: '2033-03-10',
      method: 'cash',
    });
    const late = await treasurer.put(url, { taxTreatment: 'gift' });
    expect(late.status).toBe(409);
    expect(late.body.error.code).toBe('cash_already_received');
    expect(
      (await treasurer.put('/api/admin/sponsors/agreements/999999999/tax-treatment', { taxTreatment: 'gift' })).status,
    ).toBe(404);
  });
});

describe('GET /api/admin/sponsors/agreements/:agreementId/invoice.pdf', () => {
  const pdf = (url: string) =>
    treasurer
      .get(url)
      .buffer(true)
      .parse((r, cb) => {
        const parts: Buffer[] = [];
        r.on('data', (c: Buffer) => parts.push(c));
        r.on('end', () => cb(null, Buffer.concat(parts)));
      });

  it('gives the invoice of a promotion agreement as a PDF, and 409 for a gift', async () => {
    const promo = await agreement('Invoice Promo', { cashCents: 40_000, taxTreatment: 'promotion', taxProvince: 'NS' });
    const res = await pdf(`/api/admin/sponsors/agreements/${promo.res.body.id}/invoice.pdf`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const body = res.body as Buffer;
    expect(body.subarray(0, 5).toString()).toBe('%PDF-');
    expect(body.toString('latin1')).toContain(`Invoice SP-2033-${promo.res.body.id}`);
    const gift = await agreement('Invoice Gift', { cashCents: 40_000 });
    const refused = await treasurer.get(`/api/admin/sponsors/agreements/${gift.res.body.id}/invoice.pdf`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('not_promotion');
  });
});
