import { seed } from '../../seeds/03_membership';
import { statusOn } from '../../server/membership/terms';
import { dateInZone } from '../../server/platform/clock';
import { freshDatabase, type FreshDatabase } from '../helpers/fresh-database';

// Its own database: the membership jobs suite refreshes every membership's status with its own clock, which would
// change the demo rows this test reads.
let fresh: FreshDatabase;
beforeAll(async () => {
  fresh = await freshDatabase();
});
afterAll(() => fresh.drop());

describe('the membership demo seed', () => {
  it('loads once, with the demo member active at L1, terms that follow the club rules, and each paid term in the books', async () => {
    await seed(fresh.db);
    await seed(fresh.db);
    const rows = await fresh
      .db('memberships as m')
      .join('users as u', 'u.id', 'm.user_id')
      .where('u.email', 'like', '%@padside.test')
      .select('m.*', 'u.email', 'u.roles');
    const demo = rows.find((r) => r.email === 'member@padside.test');
    expect(demo).toEqual(
      expect.objectContaining({ status: 'active', certification_level: 'L1', association_number: expect.any(String) }),
    );
    expect(demo.roles).toContain('member');
    // Lapsing needs a term that ended within the 30-day grace; under the calendar rule that is only in January.
    expect(rows.map((r) => r.status)).toEqual(expect.arrayContaining(['pending', 'active', 'lapsed']));
    const today = dateInZone(new Date(), 'America/Winnipeg');
    for (const r of rows) {
      expect(statusOn(today, r.term_end, { graceDays: 30 })).toBe(r.status);
      // The demo club's calendar rule: every term ends on Dec 31 and starts on Jan 1 or on the day it was paid.
      if (r.term_end) expect(r.term_end!.slice(5)).toBe('12-31');
      expect(r.roles.includes('member')).toBe(r.status === 'active' || r.status === 'lapsing');
    }
    const paid = await fresh
      .db('membership_payments')
      .whereIn(
        'membership_id',
        rows.map((r) => r.id),
      )
      .where('status', 'paid');
    for (const p of paid) {
      const start = p.term_start!;
      expect([`${start.slice(0, 4)}-01-01`, dateInZone(p.created_at, 'America/Winnipeg')]).toContain(start);
    }
    expect(paid.length).toBe(rows.filter((r) => r.term_end).length);
    expect(paid.filter((p) => p.method !== 'card').every((p) => p.receipt_number)).toBe(true);
    const movements = await fresh.db('money_movements').whereIn(
      'idempotency_key',
      paid.map((p) => `dues:${p.idempotency_key}`),
    );
    expect(movements).toHaveLength(paid.length);
  });
});
