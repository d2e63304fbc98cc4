import { seed as seedAccounts } from '../../seeds/01_demo_accounts';
import { seed } from '../../seeds/06_announcements';
import { buildTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(() => {
  t = buildTestApp();
});
afterAll(() => t.close());

describe('the announcements demo seed', () => {
  it('loads once: confirmed sign-ups with their consent record, and a draft announcement', async () => {
    await seedAccounts(t.deps.db);
    await seed(t.deps.db);
    await seed(t.deps.db);
    const rows = await t.deps.db('subscriptions').where('email', 'like', '%@padside.test');
    expect(rows.map((r) => `${r.email} ${r.topic}`).sort()).toEqual([
      'fan@padside.test build-logs',
      'fan@padside.test launches',
      'osric.pembleton@padside.test drops',
      'osric.pembleton@padside.test launches',
      'wren.tallgrass@padside.test drops',
    ]);
    expect(rows.every((r) => r.confirmed_at > r.requested_at && r.wording_text.includes('may e-mail me'))).toBe(true);
    expect(await t.deps.db('announcements').where('subject', 'like', 'Summer fly day%')).toHaveLength(1);
  });
});
