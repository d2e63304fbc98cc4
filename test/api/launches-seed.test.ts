import { seed as seedAccounts } from '../../seeds/01_demo_accounts';
import { seed as seedMembers } from '../../seeds/03_membership';
import { DEMO_RANGE_OFFICER, seasonOf, seed } from '../../seeds/05_launches';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client } from '../helpers/users';

let t: TestApp;
beforeAll(() => {
  t = buildTestApp();
});
afterAll(() => t.close());

describe('the launches demo seed', () => {
  it('loads once: the range officer, launch days in each state, and flown cards at the done one', async () => {
    await seedAccounts(t.deps.db);
    await seedMembers(t.deps.db);
    await seed(t.deps.db);
    await seed(t.deps.db);
    const rso = await t.deps.db('users').where('email', DEMO_RANGE_OFFICER.email).first();
    expect(rso.roles).toContain('range_officer');
    const launches = await t.deps.db('launches').where('created_by', rso.id);
    expect(launches.map((l) => l.status).sort()).toEqual(['called_off', 'done', 'scheduled', 'scheduled']);
    // Dates are relative to today, so a title that names a season names the one of its date.
    const dated = await t.deps
      .db('launches')
      .where('created_by', rso.id)
      .select('title', t.deps.db.raw("to_char(launch_date, 'YYYY-MM-DD') AS date"));
    for (const l of dated) {
      const named = /\b(Spring|Summer|Autumn|Fall|Winter)\b/.exec(l.title)?.[1];
      if (named) expect(`${l.title}: ${named}`).toBe(`${l.title}: ${seasonOf(l.date)}`);
    }
    const done = launches.find((l) => l.status === 'done')!;
    const flights = await t.deps.db('flights').where('launch_id', done.id);
    expect(flights).toHaveLength(3);
    expect(flights.every((f) => f.status === 'flown' && f.outcome)).toBe(true);
    const data = await t.deps.db('flight_data').whereIn(
      'flight_id',
      flights.map((f) => f.id),
    );
    expect(data).toHaveLength(2);
    // The Coulee Crow's made-up log: 65 m/s^2 for 1.6 s, then coast: 83.2 + 104^2 / (2 x 9.80665) = 634.7 m (analytic).
    const crow = flights.find((f) => f.rocket_name === 'Coulee Crow')!;
    expect(data.find((d) => d.flight_id === crow.id)!.summary.apogeeMetres).toBeCloseTo(634.7, -1);
    // The demo member's cards show in their logbook and the range officer signs in with the demo password.
    const client = new Client(t.app);
    await client.signIn({ email: DEMO_RANGE_OFFICER.email, password: 'padside-demo-2026' });
    expect((await client.get(`/api/admin/launches/${done.id}/queue`)).status).toBe(200);
  });
});
