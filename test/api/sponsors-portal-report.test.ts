import { pdfText } from '../helpers/pdf-text';
import { buildTestApp, fixedClock, type TestApp } from '../helpers/test-app';
import { Client, createUser, signedIn } from '../helpers/users';

let t: TestApp;
let admin: Client;
const clock = fixedClock('2026-11-20T18:00:00Z');

beforeAll(async () => {
  t = buildTestApp({ clock });
  admin = (await signedIn(t.app, t.deps.db, ['fan', 'admin'])).client;
});
afterAll(() => t.close());

const stamp = Date.now().toString(36);

/** A sponsor with one agreement and a signed-in contact; the name is unique to this run. */
async function sponsor(name: string, agreement: object) {
  const created = await admin.post('/api/admin/sponsors', { name: `${name} ${stamp}` });
  expect(created.status).toBe(201);
  const added = await admin.post(`/api/admin/sponsors/${created.body.id}/agreements`, agreement);
  expect(added.status).toBe(201);
  const contact = await createUser(t.deps.db, ['fan', 'sponsor'], 'Zoë Łukasz');
  expect((await admin.post(`/api/admin/sponsors/${created.body.id}/contacts`, { email: contact.email })).status).toBe(
    201,
  );
  const client = new Client(t.app);
  await client.signIn(contact);
  return {
    id: created.body.id as number,
    agreementId: added.body.id as number,
    name: created.body.name as string,
    client,
  };
}

const pdfOf = async (client: Client, path: string) =>
  (
    await client
      .get(path)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      })
  ).body as Buffer;

describe('GET /api/sponsor-portal/me', () => {
  describe('when the sponsor stands on the public sponsors page', () => {
    it('counts the season’s listing as delivered, not late, and the staff overdue list agrees', async () => {
      // Due in June, no listing recorded by hand: the sponsor is on the page all the same (it holds a tier).
      const s = await sponsor('Standing Listing Parts', {
        season: '2026',
        cashCents: 20_000,
        deliverables: [{ kind: 'sponsors_page', quantity: 1, dueOn: '2026-06-30' }],
      });
      const wall = await new Client(t.app).get('/api/sponsors/wall');
      expect(
        wall.body.tiers.flatMap((tier: { sponsors: { id: number }[] }) => tier.sponsors.map((x) => x.id)),
      ).toContain(s.id);

      const me = await s.client.get('/api/sponsor-portal/me');
      expect(me.body.agreements[0].deliverables).toEqual([
        expect.objectContaining({ kind: 'sponsors_page', promised: 1, delivered: 1, overdue: false, listedNow: true }),
      ]);
      expect(me.body.agreements[0].overdue).toEqual([]);
      const overdue = await admin.get('/api/admin/sponsors/overdue');
      expect(overdue.body.items.filter((o: { sponsorId: number }) => o.sponsorId === s.id)).toEqual([]);
      expect(await pdfText(await pdfOf(s.client, '/api/sponsor-portal/report.pdf'))).toContain(
        'Sponsors page listing: 1 of 1 delivered',
      );
    });
  });

  describe('when the listing promise is of a season the page no longer shows', () => {
    it('stays late until someone records it', async () => {
      const s = await sponsor('Past Season Parts', {
        season: '2025',
        cashCents: 20_000,
        deliverables: [{ kind: 'sponsors_page', quantity: 1, dueOn: '2025-06-30' }],
      });
      const me = await s.client.get('/api/sponsor-portal/me');
      expect(me.body.agreements[0].deliverables).toEqual([
        expect.objectContaining({ delivered: 0, overdue: true, listedNow: false }),
      ]);
    });
  });
});

describe('the portal and its PDF report', () => {
  it('agree on the cash received, before and after staff record it', async () => {
    const s = await sponsor('Cash Agreement Parts', {
      season: '2026',
      cashCents: 30_000,
      deliverables: [{ kind: 'build_log_credit', quantity: 1, dueOn: '2026-12-31' }],
    });
    const before = (await s.client.get('/api/sponsor-portal/me')).body.agreements[0];
    expect(before).toMatchObject({ cashCents: 30_000, cashReceivedCents: 0, cashReceivedOn: null });
    expect(await pdfText(await pdfOf(s.client, '/api/sponsor-portal/report.pdf'))).toContain(
      'Cash received: $0.00 of $300.00 (not received yet)',
    );

    expect(
      (
        await admin.post(`/api/admin/sponsors/agreements/${s.agreementId}/cash-received`, {
          receivedOn: '2026-11-19',
          method: 'e-transfer',
        })
      ).status,
    ).toBe(201);
    const after = (await s.client.get('/api/sponsor-portal/me')).body.agreements[0];
    expect(after).toMatchObject({ cashReceivedCents: 30_000, cashReceivedOn: '2026-11-19' });
    expect(await pdfText(await pdfOf(s.client, '/api/sponsor-portal/report.pdf'))).toContain(
      'Cash received: $300.00 of $300.00 (received 2026-11-19)',
    );
  });

  it('prints every character of names outside Latin-1, as a PDF reader extracts them', async () => {
    const s = await sponsor('Ørsted-Nguyễn Fin Works', {
      season: '2026',
      cashCents: 0,
      inKind: [{ description: 'Fins cut by Łukasz Ørsted-Nguyễn for Zoë', valueCents: 5_000 }],
      deliverables: [{ kind: 'build_log_credit', quantity: 1, dueOn: '2026-12-31' }],
    });
    const text = await pdfText(await pdfOf(s.client, '/api/sponsor-portal/report.pdf'));
    expect(text).toContain(`Ørsted-Nguyễn Fin Works ${stamp}`);
    expect(text).toContain('In-kind: Fins cut by Łukasz Ørsted-Nguyễn for Zoë, declared value $50.00');
  });
});

describe('GET /api/admin/sponsors/agreements/:agreementId/invoice.pdf', () => {
  it('prints the sponsor’s name as typed', async () => {
    const s = await sponsor('Zoë Łukasz Ørsted-Nguyễn Promo', {
      season: '2026',
      cashCents: 10_000,
      taxTreatment: 'promotion',
      taxProvince: 'MB',
      deliverables: [{ kind: 'video_mention', quantity: 1, dueOn: '2026-12-31' }],
    });
    const text = await pdfText(await pdfOf(admin, `/api/admin/sponsors/agreements/${s.agreementId}/invoice.pdf`));
    expect(text).toContain(`Zoë Łukasz Ørsted-Nguyễn Promo ${stamp}`);
  });
});
