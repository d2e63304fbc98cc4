import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';

let t: TestApp;
let treasurer: Client;
beforeAll(async () => {
  t = buildTestApp();
  treasurer = (await signedIn(t.app, t.deps.db, ['fan', 'treasurer'])).client;
});
afterAll(() => t.close());

const newsCount = async (subject: string) =>
  Number(
    (
      await t.deps
        .db('outbound_emails')
        .where({ subject, template: 'membership-roster-news' })
        .count<{ count: string }[]>({ count: '*' })
    )[0].count,
  );

// OWASP ASVS 4.0.3 5.1.2 (protection against mass parameter assignment) and 5.1.3 (positive validation): filters
// that choose whom a message reaches or what an export holds refuse keys they do not know, instead of ignoring them
// and acting on everyone.
describe('ASVS 5.1.2: admin filters refuse unknown keys', () => {
  it('POST /api/admin/members/email answers 400 naming a misspelt filter and queues nothing', async () => {
    const subject = `Misspelt filter ${Date.now()}`;
    const res = await treasurer.post('/api/admin/members/email', {
      filters: { stauts: 'lapsed' },
      subject,
      text: 'Only for lapsed members.',
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ 'filters.stauts': expect.stringContaining('spelling') });
    expect(await newsCount(subject)).toBe(0);
  });

  it('POST /api/admin/members/email answers 400 for a misspelt top-level key (filter instead of filters)', async () => {
    const subject = `Misspelt body ${Date.now()}`;
    const res = await treasurer.post('/api/admin/members/email', {
      filter: { status: 'lapsed' },
      subject,
      text: 'Only for lapsed members.',
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('filter');
    expect(await newsCount(subject)).toBe(0);
  });

  it('POST /api/admin/members/email still takes the roster filters the console sends', async () => {
    const res = await treasurer.post('/api/admin/members/email', {
      filters: { status: 'lapsed', q: `nobody-${Date.now()}`, sort: 'name', dir: 'asc' },
      subject: 'Known filters',
      text: 'Hello.',
    });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ queued: 0, skippedOptedOut: 0, skippedLapsedConsent: 0, skippedSuppressed: 0 });
  });

  it('the roster and its CSV answer 400 for an unknown query key', async () => {
    for (const url of ['/api/admin/members?stauts=lapsed', '/api/admin/members/export.csv?stauts=lapsed']) {
      const res = await treasurer.get(url);
      expect(res.status).toBe(400);
      expect(res.body.error.fields).toHaveProperty('stauts');
    }
    expect((await treasurer.get('/api/admin/members?status=lapsed')).status).toBe(200);
  });

  it('the order list and its CSV answer 400 for an unknown query key', async () => {
    for (const url of ['/api/admin/orders?stauts=paid', '/api/admin/orders/export?stauts=paid']) {
      const res = await treasurer.get(url);
      expect(res.status).toBe(400);
      expect(res.body.error.fields).toHaveProperty('stauts');
    }
    expect((await treasurer.get('/api/admin/orders?status=paid')).status).toBe(200);
  });
});
