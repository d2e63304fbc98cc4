import { buildTestApp, type TestApp } from '../helpers/test-app';
import { type Client, signedIn } from '../helpers/users';

let t: TestApp;
let staff: Client;

beforeAll(async () => {
  t = buildTestApp();
  staff = (await signedIn(t.app, t.deps.db, ['fan', 'treasurer'])).client;
});
afterAll(() => t.close());

// Suites share one database: this file reads the carrier and sends refused values, so the stored one never changes.
describe('GET /api/admin/shop/settings', () => {
  it('gives the usual carrier, blank until staff set one', async () => {
    const res = await staff.get('/api/admin/shop/settings');
    expect(res.status).toBe(200);
    expect(res.body.settings.carrier).toBe('');
  });
});

describe('PUT /api/admin/shop/settings', () => {
  describe('when the carrier is too long', () => {
    it('answers 400 beside the carrier field', async () => {
      const current = (await staff.get('/api/admin/shop/settings')).body.settings;
      const res = await staff.put('/api/admin/shop/settings', { ...current, carrier: 'x'.repeat(61) });
      expect(res.status).toBe(400);
      expect(res.body.error.fields).toEqual({ carrier: 'At most 60 characters.' });
    });
  });
});
