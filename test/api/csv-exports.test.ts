import { randomUUID } from 'node:crypto';
import { parse } from 'csv-parse/sync';
import { recordMovement } from '../../server/books/ledger-writer';
import { BooksRepository } from '../../server/books/books-repository';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';
import { MB_ADDRESS, methodId, openShirt } from './shop-fixtures';

// Every export starts with the UTF-8 byte-order mark, has headers in words, carries instants as ISO 8601 in club time
// with the zone named in the header, and lists its rows in date order.
let t: TestApp;
let staff: Client;
const tag = randomUUID().slice(0, 6);
const SNAKE = /\b[a-z]+_[a-z_]+\b/;

beforeAll(async () => {
  t = buildTestApp();
  staff = (await signedIn(t.app, t.deps.db, ['fan', 'treasurer'])).client;
});
afterAll(() => t.close());

const rowsOf = (text: string): string[][] => parse(text.replace(/^\uFEFF/, ''), { relaxQuotes: false });

async function order(variantId: number) {
  const c = new Client(t.app);
  const res = await c.post('/api/orders', {
    items: [{ variantId, quantity: 1 }],
    shipTo: MB_ADDRESS,
    shippingMethodId: await methodId(c, 'canada'),
    email: `csv-${tag}-${randomUUID().slice(0, 4)}@example.test`,
    paymentToken: 'tok_visa',
  });
  if (res.status !== 201) throw new Error(JSON.stringify(res.body));
  return res.body.order as { id: number; number: string };
}

describe('GET /api/admin/orders/export', () => {
  it('lists orders oldest first by the instant, in club time with the offset, whatever the table sort', async () => {
    const shirt = await openShirt(staff);
    const first = await order(shirt.variants[0].id);
    const second = await order(shirt.variants[0].id);
    // The night the clocks go back in Winnipeg (IANA tz database, northamerica, Rule Canada: 2026-11-01 07:00 UTC):
    // the order placed second gets the earlier instant, 01:30 daylight time; the other 01:10 standard time, 40 minutes later.
    await t.deps
      .db('shop_orders')
      .where('id', second.id)
      .update({ created_at: new Date('2026-11-01T06:30:00Z') });
    await t.deps
      .db('shop_orders')
      .where('id', first.id)
      .update({ created_at: new Date('2026-11-01T07:10:00Z') });
    const res = await staff.get(`/api/admin/orders/export?runId=${shirt.run.id}&sort=number&dir=desc`);
    expect(res.status).toBe(200);
    expect(res.text.charCodeAt(0)).toBe(0xfeff);
    const [header, ...rows] = rowsOf(res.text);
    expect(header.join(',')).not.toMatch(SNAKE);
    expect(header.slice(0, 3)).toEqual(['Order number', 'Placed at (America/Winnipeg)', 'Status']);
    expect(rows.map((r) => r.slice(0, 3))).toEqual([
      [second.number, '2026-11-01T01:30-05:00', 'Paid'],
      [first.number, '2026-11-01T01:10-06:00', 'Paid'],
    ]);
  });
});

describe('GET /api/admin/reports/ledger.csv', () => {
  // Fixtures in 2017, outside every other file's ranges; the rows are written out of date order on purpose.
  const range = { from: '2017-05-01', to: '2017-05-31' };
  beforeAll(async () => {
    const db = t.deps.db;
    await db('money_movements')
      .where('occurred_at', '>=', '2017-01-01')
      .andWhere('occurred_at', '<', '2018-01-01')
      .delete();
    const on = (at: string, reference: string) =>
      db.transaction((trx) =>
        recordMovement(trx, {
          occurredAt: new Date(at),
          kind: 'dues_payment',
          source: 'dues',
          grossCents: 4500,
          reference,
          counterparty: `Ledger ${tag}`,
          method: 'cash',
        }),
      );
    await on('2017-05-20T18:00:00Z', 'L-3');
    await on('2017-05-02T18:00:00Z', 'L-1');
    await on('2017-05-02T18:00:00Z', 'L-2');
    // 04:30 UTC on 1 June is 23:30 on 31 May in club time (CDT, UTC-5), so it belongs to May.
    await on('2017-06-01T04:30:00Z', 'L-4');
    // Microseconds that a JavaScript Date cannot hold: the page cursor must keep them.
    await db('money_movements')
      .where({ reference: 'L-2' })
      .update({ occurred_at: db.raw("'2017-05-02 18:00:00.000001+00'::timestamptz") });
    await db('money_movements')
      .where({ reference: 'L-1' })
      .update({ occurred_at: db.raw("'2017-05-02 18:00:00.000001+00'::timestamptz") });
  });

  it('lists the movements in the order they happened, dated in club time, with labels', async () => {
    const res = await staff.get(`/api/admin/reports/ledger.csv?from=${range.from}&to=${range.to}`);
    expect(res.status).toBe(200);
    expect(res.text.charCodeAt(0)).toBe(0xfeff);
    const [header, ...rows] = rowsOf(res.text);
    expect(header[0]).toBe('Date (America/Winnipeg)');
    expect(header.join(',')).not.toMatch(SNAKE);
    const mine = rows.filter((r) => r[4] === `Ledger ${tag}`);
    expect(mine.map((r) => [r[0], r[3]])).toEqual([
      ['2017-05-02', 'L-1'],
      ['2017-05-02', 'L-2'],
      ['2017-05-20', 'L-3'],
      ['2017-05-31', 'L-4'],
    ]);
    expect(mine[0].slice(1, 3)).toEqual(['Dues payment', 'Dues']);
    expect(mine[0][5]).toBe('Cash');
  });

  it('pages by instant and id without losing or repeating rows that share an instant', async () => {
    const repo = new BooksRepository(t.deps.db, 'America/Winnipeg');
    const seen: string[] = [];
    for (let after: { occurredAt: string; id: number } | null = null; ;) {
      const page = await repo.ledgerPage(range, after, 1);
      if (!page.length) break;
      seen.push(page[0].reference);
      after = page[0];
    }
    expect(seen.filter((r) => r.startsWith('L-'))).toEqual(['L-1', 'L-2', 'L-3', 'L-4']);
  });
});
