import { buildTestApp, fixedClock, type TestApp } from '../helpers/test-app';
import { Client, createUser, signedIn, type TestUser } from '../helpers/users';

let t: TestApp;
let admin: Client;
let editor: Client;
const clock = fixedClock('2026-11-20T18:00:00Z');

beforeAll(async () => {
  t = buildTestApp({ clock });
  admin = (await signedIn(t.app, t.deps.db, ['fan', 'admin'])).client;
  editor = (await signedIn(t.app, t.deps.db, ['fan', 'editor'])).client;
});
afterAll(() => t.close());

async function sponsorWithContact(name: string): Promise<{ id: number; contact: TestUser; client: Client }> {
  const { body } = await admin.post('/api/admin/sponsors', { name });
  await admin.post(`/api/admin/sponsors/${body.id}/agreements`, {
    season: '2026',
    cashCents: 30_000,
    inKind: [{ description: '=HYPERLINK("http://evil.test")', valueCents: 1_000 }],
    deliverables: [{ kind: 'build_log_credit', quantity: 2, dueOn: '2026-12-31' }],
  });
  const contact = await createUser(t.deps.db, ['fan', 'sponsor'], `${name} Contact`);
  await admin.post(`/api/admin/sponsors/${body.id}/contacts`, { email: contact.email });
  const client = new Client(t.app);
  await client.signIn(contact);
  return { id: body.id, contact, client };
}

describe('GET /api/sponsor-portal/me', () => {
  it('shows the sponsor only its own agreements and credits, with links and dates', async () => {
    const a = await sponsorWithContact('Portal Alpha Parts');
    const b = await sponsorWithContact('Portal Beta Boards');
    const post = await editor.post('/api/admin/posts', {
      title: 'Alpha build',
      markdown: 'x',
      status: 'published',
      credits: [a.id],
    });
    expect(post.status).toBe(201);

    const mine = await a.client.get('/api/sponsor-portal/me');
    expect(mine.status).toBe(200);
    expect(mine.body.sponsor.name).toBe('Portal Alpha Parts');
    expect(mine.body.credits).toEqual([
      expect.objectContaining({
        kind: 'build_log_credit',
        postSlug: 'alpha-build',
        at: '2026-11-20T18:00:00.000Z',
        url: expect.stringMatching(/\/build-logs\/alpha-build$/),
      }),
    ]);
    expect(mine.body.agreements[0].deliverables[0]).toMatchObject({ promised: 2, delivered: 1 });

    const theirs = await b.client.get('/api/sponsor-portal/me');
    expect(theirs.body.sponsor.name).toBe('Portal Beta Boards');
    expect(theirs.body.credits).toEqual([]);
  });

  it('refuses the staff ledger of any sponsor to a sponsor account (403)', async () => {
    const a = await sponsorWithContact('Portal Gamma Gears');
    const b = await sponsorWithContact('Portal Delta Drives');
    expect((await a.client.get(`/api/admin/sponsors/${b.id}/ledger`)).status).toBe(403);
    expect((await a.client.get(`/api/admin/sponsors/${a.id}/ledger`)).status).toBe(403);
  });

  it('answers 404 with a clear message for a sponsor account linked to no sponsor', async () => {
    const { client } = await signedIn(t.app, t.deps.db, ['fan', 'sponsor']);
    const res = await client.get('/api/sponsor-portal/me');
    expect(res.status).toBe(404);
    expect(res.body.error.message).toMatch(/not linked to a sponsor/);
  });

  it('answers 409 when staff add a contact without the sponsor role', async () => {
    const { body } = await admin.post('/api/admin/sponsors', { name: 'Role Check Rockets' });
    const fan = await createUser(t.deps.db, ['fan']);
    const res = await admin.post(`/api/admin/sponsors/${body.id}/contacts`, { email: fan.email });
    expect(res.status).toBe(409);
    expect(res.body.error.fields.email).toBeDefined();
  });
});

describe('acknowledgement report downloads', () => {
  it('gives a CSV with neutralised formula cells and the not-a-receipt statement', async () => {
    const a = await sponsorWithContact('Report CSV Co');
    const res = await a.client.get('/api/sponsor-portal/report.csv');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(
      /attachment; filename="acknowledgement-report-csv-co-2026-11-20\.csv"/,
    );
    expect(res.text.split('\r\n')[0]).toBe(
      '\uFEFFLine,Season,Item,Declared value (CAD),Date (America/Winnipeg),Title or note,Link',
    );
    expect(res.text.trim().split('\r\n').pop()).toMatch(/^Note,/);
    // OWASP "CSV Injection": a cell starting with = is prefixed with a single quote.
    expect(res.text).toContain(`"In-kind: =HYPERLINK(""http://evil.test"")"`);
    expect(res.text).not.toMatch(/(^|,)"=/m);
    expect(res.text).toMatch(/not an official donation receipt/);
    expect(res.text).toMatch(/registered charities and other qualified donees/);
  });

  it('gives a PDF', async () => {
    const a = await sponsorWithContact('Report PDF Co');
    const res = await a.client
      .get('/api/sponsor-portal/report.pdf')
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const pdf = res.body as Buffer;
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    expect(pdf.length).toBeGreaterThan(1000);
  });
});

describe('GET /api/sponsors/wall', () => {
  it('groups sponsors by tier, highest first, with the posts that credit them', async () => {
    const a = await sponsorWithContact('Wall Listed Ltd');
    await editor.post('/api/admin/posts', {
      title: 'Wall credit post',
      markdown: 'x',
      status: 'published',
      credits: [a.id],
    });
    const res = await new Client(t.app).get('/api/sponsors/wall');
    expect(res.status).toBe(200);
    const tier = res.body.tiers.find((x: { sponsors: { id: number }[] }) => x.sponsors.some((s) => s.id === a.id));
    expect(tier).toBeDefined();
    expect(tier.sponsors.find((s: { id: number }) => s.id === a.id).posts).toEqual([
      { slug: 'wall-credit-post', title: 'Wall credit post' },
    ]);
  });
});
