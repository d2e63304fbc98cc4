import { buildTestApp, fixedClock, type TestApp } from '../helpers/test-app';
import { Client, createUser, signedIn } from '../helpers/users';

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
beforeEach(() => clock.set('2026-11-20T18:00:00Z'));

/** A sponsor with one 2026 agreement promising `credits` build-log credits due on `dueOn`, and a contact. */
async function sponsorWithAgreement(name: string, credits: number, dueOn: string, cashCents = 20_000) {
  const created = await admin.post('/api/admin/sponsors', {
    name,
    website: 'https://example.test',
    blurb: 'Invented for a test.',
  });
  expect(created.status).toBe(201);
  const id = created.body.id as number;
  const agreement = await admin.post(`/api/admin/sponsors/${id}/agreements`, {
    season: '2026',
    cashCents,
    inKind: [{ description: 'Test parts', valueCents: 5_000 }],
    deliverables: [
      { kind: 'build_log_credit', quantity: credits, dueOn },
      { kind: 'video_mention', quantity: 1, dueOn: '2026-12-31' },
    ],
  });
  expect(agreement.status).toBe(201);
  const contact = await createUser(t.deps.db, ['fan', 'sponsor'], `${name} Contact`);
  expect((await admin.post(`/api/admin/sponsors/${id}/contacts`, { userId: contact.id })).status).toBe(201);
  return { id, slug: created.body.slug as string, agreementId: agreement.body.id as number, contact };
}

const post = (title: string, credits: number[], status = 'published') => ({
  title,
  markdown: `About ${title}.`,
  status,
  credits,
});

const ledgerOf = async (id: number) =>
  (await admin.get(`/api/admin/sponsors/${id}/ledger`)).body.agreements[0].deliverables as {
    kind: string;
    promised: number;
    delivered: number;
    dueOn: string;
    overdue: boolean;
  }[];
const outbox = (to: string) =>
  t.deps.db('outbound_emails').where({ to_address: to, template: 'sponsor-credit-published' });

describe('publishing a crediting post', () => {
  describe('when the post is published, unpublished and published again', () => {
    it('records one credit, withdraws it, records it again, and e-mails the contact once', async () => {
      const s = await sponsorWithAgreement('Ledger Test Widgets', 2, '2026-12-31');
      const created = await editor.post('/api/admin/posts', post('A crediting build', [s.id]));
      expect(created.status).toBe(201);
      let line = (await ledgerOf(s.id)).find((d) => d.kind === 'build_log_credit')!;
      expect(line).toMatchObject({ promised: 2, delivered: 1, overdue: false });
      expect(await outbox(s.contact.email)).toHaveLength(1);

      expect(
        (await editor.put(`/api/admin/posts/${created.body.id}`, post('A crediting build', [s.id], 'draft'))).status,
      ).toBe(200);
      line = (await ledgerOf(s.id)).find((d) => d.kind === 'build_log_credit')!;
      expect(line.delivered).toBe(0);

      expect((await editor.put(`/api/admin/posts/${created.body.id}`, post('A crediting build', [s.id]))).status).toBe(
        200,
      );
      line = (await ledgerOf(s.id)).find((d) => d.kind === 'build_log_credit')!;
      expect(line.delivered).toBe(1);
      expect(await outbox(s.contact.email)).toHaveLength(1);
      const mail = (await outbox(s.contact.email))[0];
      expect(mail.subject).toContain('Ledger Test Widgets');
      expect(mail.text_body).toContain('/build-logs/a-crediting-build');
    });
  });

  describe('when a draft credits a sponsor', () => {
    it('records nothing until it is published', async () => {
      const s = await sponsorWithAgreement('Draft Only Supplies', 1, '2026-12-31');
      await editor.post('/api/admin/posts', post('Still a draft', [s.id], 'draft'));
      expect((await ledgerOf(s.id)).find((d) => d.kind === 'build_log_credit')!.delivered).toBe(0);
      expect(await outbox(s.contact.email)).toHaveLength(0);
    });
  });

  describe('when the body carries a credit marker', () => {
    it('credits the named sponsor without the editor panel', async () => {
      const s = await sponsorWithAgreement('Marker Motors Hobby', 1, '2026-12-31');
      const res = await editor.post('/api/admin/posts', {
        title: 'Marker post',
        markdown: `Thanks!\n\n%thanks ${s.slug} | for the parts\n`,
        status: 'published',
      });
      expect(res.status).toBe(201);
      expect((await ledgerOf(s.id)).find((d) => d.kind === 'build_log_credit')!.delivered).toBe(1);
      const page = await t.deps.db('posts').where('id', res.body.id).first();
      expect((await new Client(t.app).get(`/api/posts/${page.slug}`)).body.credits).toEqual([
        { sponsorId: s.id, name: 'Marker Motors Hobby', slug: s.slug },
      ]);
    });

    it('answers 400 on the markdown field when the marker names no sponsor', async () => {
      const res = await editor.post('/api/admin/posts', {
        title: 'Bad marker',
        markdown: '%thanks nobody-at-all\n',
        status: 'draft',
      });
      expect(res.status).toBe(400);
      expect(res.body.error.fields.markdown).toMatch(/nobody-at-all/);
    });
  });

  describe('when the credit marker names a deliverable', () => {
    /** A sponsor whose 2026 agreement promises two build-log credits lines (due in December and in March) and a video mention. */
    async function sponsorWithTwoPromises(name: string) {
      const created = await admin.post('/api/admin/sponsors', {
        name,
        website: 'https://example.test',
        blurb: 'Invented for a test.',
      });
      const id = created.body.id as number;
      const deliverables = [
        { kind: 'build_log_credit', quantity: 1, dueOn: '2026-12-31' },
        { kind: 'build_log_credit', quantity: 2, dueOn: '2027-03-31' },
        { kind: 'video_mention', quantity: 1, dueOn: '2026-12-15' },
      ];
      expect((await admin.post(`/api/admin/sponsors/${id}/agreements`, { season: '2026', deliverables })).status).toBe(
        201,
      );
      const lines = (await admin.get(`/api/admin/sponsors/${id}/ledger`)).body.agreements[0].deliverables as {
        id: number;
        kind: string;
        dueOn: string;
      }[];
      const byDue = (dueOn: string) => lines.find((l) => l.dueOn === dueOn)!.id;
      return {
        id,
        slug: created.body.slug as string,
        earliest: byDue('2026-12-31'),
        later: byDue('2027-03-31'),
        video: byDue('2026-12-15'),
      };
    }
    const delivered = async (sponsorId: number) =>
      Object.fromEntries((await ledgerOf(sponsorId)).map((d) => [d.dueOn, d.delivered]));

    it('credits the named deliverable, not the earliest due, and the page shows the same card', async () => {
      const s = await sponsorWithTwoPromises('Named Promise Nozzles');
      const res = await editor.post('/api/admin/posts', {
        title: 'Named promise post',
        markdown: `%thanks ${s.slug} #${s.later} | nozzles\n`,
        status: 'published',
      });
      expect(res.status).toBe(201);
      expect(await delivered(s.id)).toEqual({ '2026-12-31': 0, '2027-03-31': 1, '2026-12-15': 0 });
      const page = await new Client(t.app).get(`/api/posts/${res.body.slug}`);
      expect(page.body.html).toContain('<strong>Named Promise Nozzles</strong> — nozzles');
      expect(page.body.html).not.toContain(`#${s.later}`);
    });

    it('falls back to the earliest due when the named one is of another kind or delivered in full', async () => {
      const s = await sponsorWithTwoPromises('Fallback Fasteners');
      const video = await editor.post('/api/admin/posts', {
        title: 'Names the video line',
        markdown: `%thanks ${s.slug} #${s.video}\n`,
        status: 'published',
      });
      expect(video.status).toBe(201);
      expect(await delivered(s.id)).toEqual({ '2026-12-31': 1, '2027-03-31': 0, '2026-12-15': 0 });
      const full = await editor.post('/api/admin/posts', {
        title: 'Names the full line',
        markdown: `%thanks ${s.slug} #${s.earliest}\n`,
        status: 'published',
      });
      expect(full.status).toBe(201);
      expect(await delivered(s.id)).toEqual({ '2026-12-31': 1, '2027-03-31': 1, '2026-12-15': 0 });
    });

    it('answers 400 on the markdown field when the deliverable is another sponsor’s, and saves nothing', async () => {
      const mine = await sponsorWithTwoPromises('Own Promise Optics');
      const theirs = await sponsorWithTwoPromises('Other Promise Optics');
      const res = await editor.post('/api/admin/posts', {
        title: 'Wrong promise',
        markdown: `%thanks ${mine.slug} #${theirs.later}\n`,
        status: 'published',
      });
      expect(res.status).toBe(400);
      expect(res.body.error.fields.markdown).toMatch(new RegExp(`#${theirs.later}`));
      expect(await t.deps.db('posts').where('title', 'Wrong promise')).toHaveLength(0);
      expect(await delivered(theirs.id)).toEqual({ '2026-12-31': 0, '2027-03-31': 0, '2026-12-15': 0 });
    });
  });

  describe('when more posts credit the sponsor than were promised', () => {
    it('fills the earliest deliverable first and records the extra credit as uncounted', async () => {
      const s = await sponsorWithAgreement('Overflow Optics', 1, '2026-12-31');
      await editor.post('/api/admin/posts', post('Overflow one', [s.id]));
      await editor.post('/api/admin/posts', post('Overflow two', [s.id]));
      expect((await ledgerOf(s.id)).find((d) => d.kind === 'build_log_credit')!.delivered).toBe(1);
      const detail = await admin.get(`/api/admin/sponsors/${s.id}`);
      expect(detail.body.credits.map((c: { counted: boolean }) => c.counted).sort()).toEqual([false, true]);
    });
  });
});

describe('GET /api/admin/sponsors/:id/ledger', () => {
  describe('when the due date passes without delivery', () => {
    it('is not overdue on the due date and overdue the day after (club time zone)', async () => {
      const s = await sponsorWithAgreement('Overdue Outfitters', 1, '2026-11-20');
      // 2026-11-20T18:00Z is 12:00 in Winnipeg on the 20th.
      expect((await ledgerOf(s.id)).find((d) => d.kind === 'build_log_credit')!.overdue).toBe(false);
      // 2026-11-21T05:59Z is still the 20th in Winnipeg (UTC-6): not overdue yet.
      clock.set('2026-11-21T05:59:00Z');
      expect((await ledgerOf(s.id)).find((d) => d.kind === 'build_log_credit')!.overdue).toBe(false);
      clock.set('2026-11-21T06:00:00Z');
      expect((await ledgerOf(s.id)).find((d) => d.kind === 'build_log_credit')!.overdue).toBe(true);
      const overdue = await admin.get('/api/admin/sponsors/overdue');
      expect(overdue.body.items).toContainEqual(
        expect.objectContaining({ sponsorId: s.id, kind: 'build_log_credit', promised: 1, delivered: 0 }),
      );
    });
  });

  it('reports promised vs delivered per kind and the next due', async () => {
    const s = await sponsorWithAgreement('Summary Sprockets', 2, '2026-12-01');
    const res = await admin.get(`/api/admin/sponsors/${s.id}/ledger`);
    expect(res.status).toBe(200);
    const a = res.body.agreements[0];
    expect(a.byKind).toEqual([
      { kind: 'build_log_credit', promised: 2, delivered: 0 },
      { kind: 'video_mention', promised: 1, delivered: 0 },
    ]);
    expect(a.nextDue).toMatchObject({ kind: 'build_log_credit', dueOn: '2026-12-01' });
    expect(a.totalCents).toBe(25_000);
  });
});

describe('GET /api/admin/sponsors/:id/ledger.csv', () => {
  it('exports the ledger lines as CSV', async () => {
    const s = await sponsorWithAgreement('Csv Export Co', 2, '2026-11-01');
    const res = await editor.get(`/api/admin/sponsors/${s.id}/ledger.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-disposition']).toContain('ledger-csv-export-co-2026-11-20.csv');
    expect(res.text).toBe(
      '\uFEFFSeason,Deliverable,Promised,Delivered,Due on,State\r\n2026,Build log credit,2,0,2026-11-01,Overdue\r\n2026,Video mention,1,0,2026-12-31,Open\r\n',
    );
  });
});

describe('POST /api/admin/sponsors/:id/credits', () => {
  it('records a video mention by hand against the open deliverable', async () => {
    const s = await sponsorWithAgreement('Hobblewick Hobbies', 1, '2026-12-31');
    const res = await editor.post(`/api/admin/sponsors/${s.id}/credits`, {
      kind: 'video_mention',
      url: 'https://video.example.test/watch/abc',
      videoTimestamp: '4:35',
      note: 'Shout-out at the pad',
    });
    expect(res.status).toBe(201);
    expect(res.body.counted).toBe(true);
    expect((await ledgerOf(s.id)).find((d) => d.kind === 'video_mention')!.delivered).toBe(1);
  });

  it('answers 400 beside the field for a bad URL, a bad timestamp or a build-log credit', async () => {
    const s = await sponsorWithAgreement('Field Errors Inc', 1, '2026-12-31');
    const res = await editor.post(`/api/admin/sponsors/${s.id}/credits`, {
      kind: 'social_post',
      url: 'javascript:alert(1)',
      videoTimestamp: 'soon',
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['url', 'videoTimestamp']);
    const kind = await editor.post(`/api/admin/sponsors/${s.id}/credits`, {
      kind: 'build_log_credit',
      url: 'https://x.test',
    });
    expect(kind.status).toBe(400);
    expect(kind.body.error.fields.kind).toMatch(/publishing a post/);
  });
});

describe('POST /api/admin/sponsors/:id/agreements', () => {
  it('answers 409 for a second agreement in the same season and 400 for bad lines', async () => {
    const s = await sponsorWithAgreement('Twice Shy Supply', 1, '2026-12-31');
    const again = await admin.post(`/api/admin/sponsors/${s.id}/agreements`, { season: '2026', deliverables: [] });
    expect(again.status).toBe(409);
    const bad = await admin.post(`/api/admin/sponsors/${s.id}/agreements`, {
      season: '26',
      cashCents: -1,
      deliverables: [{ kind: 'billboard', quantity: 0, dueOn: '2026-13-01' }],
    });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual([
      'cashCents',
      'deliverables.0.dueOn',
      'deliverables.0.kind',
      'deliverables.0.quantity',
      'season',
    ]);
  });

  it('records received cash once as a sponsor_cash money movement', async () => {
    const s = await sponsorWithAgreement('Cash Counter Co', 1, '2026-12-31', 12_345);
    const first = await admin.post(`/api/admin/sponsors/agreements/${s.agreementId}/cash-received`, {
      receivedOn: '2026-11-19',
      method: 'e-transfer',
    });
    expect(first.status).toBe(201);
    const again = await admin.post(`/api/admin/sponsors/agreements/${s.agreementId}/cash-received`, {
      receivedOn: '2026-11-19',
      method: 'e-transfer',
    });
    expect(again.status).toBe(409);
    const rows = await t.deps.db('money_movements').where({ kind: 'sponsor_cash', reference: String(s.agreementId) });
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({
      source: 'sponsor',
      counterparty: 'Cash Counter Co',
      gross_cents: 12345,
      method: 'e-transfer',
    });
  });
});

describe('tiers', () => {
  it('places sponsors by season total at the staff-set thresholds (a total equal to a threshold reaches it)', async () => {
    const put = await admin.put('/api/admin/sponsors/tiers', {
      tiers: [
        { name: 'Spark', minCents: 0 },
        { name: 'Flame', minCents: 25_000 },
        { name: 'Blaze', minCents: 100_000 },
      ],
    });
    expect(put.status).toBe(200);
    // Totals are cash + in-kind (5,000): 19,999 + 5,000 = 24,999 stays Spark; 20,000 + 5,000 = 25,000 reaches Flame.
    const below = await sponsorWithAgreement('Tier Below', 1, '2026-12-31', 19_999);
    const at = await sponsorWithAgreement('Tier At', 1, '2026-12-31', 20_000);
    const top = await sponsorWithAgreement('Tier Top', 1, '2026-12-31', 95_000);
    const list = (await new Client(t.app).get('/api/sponsors')).body.items as { id: number; tier: string }[];
    const tierOf = (id: number) => list.find((s) => s.id === id)!.tier;
    expect([tierOf(below.id), tierOf(at.id), tierOf(top.id)]).toEqual(['Spark', 'Flame', 'Blaze']);
    const bad = await admin.put('/api/admin/sponsors/tiers', {
      tiers: [
        { name: 'A', minCents: 0 },
        { name: 'B', minCents: 0 },
      ],
    });
    expect(bad.status).toBe(400);
  });
});
