import { buildTestApp, fixedClock, type TestApp } from '../helpers/test-app';
import { signedIn, type Client } from '../helpers/users';

// 2028 dates keep these memberships clear of the other membership files' daily jobs.
const clock = fixedClock('2028-04-10T17:00:00Z');
let t: TestApp;
let treasurer: Client;
let rso: Client;
let adultPlan: number;
const tag = `F${Date.now().toString(36)}`;

beforeAll(async () => {
  t = buildTestApp({ clock });
  treasurer = (await signedIn(t.app, t.deps.db, ['fan', 'treasurer'])).client;
  rso = (await signedIn(t.app, t.deps.db, ['fan', 'editor'])).client;
  adultPlan = (await treasurer.get('/api/membership/plans')).body.items.find(
    (p: { code: string }) => p.code === 'adult',
  ).id;
});
afterAll(() => t.close());
beforeEach(() => clock.set('2028-04-10T17:00:00Z'));

async function member(name: string, over: Record<string, unknown> = {}) {
  const s = await signedIn(t.app, t.deps.db);
  const res = await s.client.post('/api/membership', {
    planId: adultPlan,
    profile: {
      legalName: `${name} ${tag}`,
      dateOfBirth: '1981-05-05',
      address: '12 Coulee Road, Gopher Flats, MB',
      phone: '204-555-0190',
      emergencyContact: 'Sibling 204-555-0191',
      certificationLevel: 'none',
      ...over,
    },
    waiverVersion: '2026-1',
    paymentToken: 'tok_visa',
  });
  expect(res.status).toBe(201);
  const row = await t.deps.db('memberships').where('user_id', s.user.id).first();
  const token: string = (await s.client.get('/api/membership/card')).body.card.token;
  const checkIn = async () => {
    const r = await rso.post('/api/admin/checkin', { token });
    expect(r.status).toBe(200);
    return r.body;
  };
  return { ...s, id: Number(row.id), checkIn };
}

const verifyAssociation = (
  id: number,
  number: string,
  expires: string,
  against = 'Association card, seen at the field',
) =>
  treasurer.post(`/api/admin/members/${id}/verifications`, {
    what: 'association',
    against,
    associationNumber: number,
    associationExpires: expires,
  });

// OWASP ASVS 4.0.3 4.1.2 (attributes used in access decisions cannot be changed by end users unless authorised):
// a member could set their own certification level and association expiry, and check-in showed them as facts.
describe('ASVS 4.1.2: flying status is verified by staff, not claimed', () => {
  it('shows a member\'s own L3 and far-off association expiry as claims, and the verdict is not "may fly"', async () => {
    const m = await member('Claimant');
    const patch = await m.client.patch('/api/membership/me', {
      certificationLevel: 'L3',
      associationNumber: 'NA-31337',
      associationExpires: '2099-12-31',
    });
    expect(patch.status).toBe(200);
    const r = await m.checkIn();
    expect(r.status).toBe('active');
    expect(r.mayFly).toBe(false);
    expect(r.dues).toEqual({ answer: 'current', termEnd: expect.any(String) });
    expect(r.association).toEqual({ answer: 'claimed', number: 'NA-31337', expires: '2099-12-31', verified: null });
    expect(r.certification).toEqual(expect.objectContaining({ answer: 'claimed', level: 'L3', verified: null }));
  });

  it('says "may fly" once staff verify the association, recording who, when and against what', async () => {
    const m = await member('Verified', {
      associationNumber: 'NA-4001',
      associationExpires: '2028-12-31',
      certificationLevel: 'L1',
    });
    const res = await verifyAssociation(m.id, 'NA-4001', '2028-12-31');
    expect(res.status).toBe(200);
    expect(res.body.verifications.association).toEqual({
      at: '2028-04-10T17:00:00.000Z',
      by: 'Test User',
      against: 'Association card, seen at the field',
    });
    expect(res.body.audit.some((a: { action: string }) => a.action === 'association_verified')).toBe(true);
    const r = await m.checkIn();
    expect(r.mayFly).toBe(true);
    expect(r.association.answer).toBe('verified');
    expect(r.association.verified.against).toBe('Association card, seen at the field');
    // The certification is its own answer: still a claim, and it does not decide the overall verdict.
    expect(r.certification.answer).toBe('claimed');
    const cert = await treasurer.post(`/api/admin/members/${m.id}/verifications`, {
      what: 'certification',
      against: 'Level 1 certificate, scanned copy',
      certificationLevel: 'L1',
    });
    expect(cert.status).toBe(200);
    expect((await m.checkIn()).certification).toEqual(
      expect.objectContaining({ answer: 'verified', level: 'L1', label: expect.any(String) }),
    );
  });

  it('returns a verified value to unverified when the member edits it, and keeps it when the same value is sent again', async () => {
    const m = await member('Editor', {
      associationNumber: 'NA-4002',
      associationExpires: '2028-11-30',
      certificationLevel: 'L2',
    });
    await verifyAssociation(m.id, 'NA-4002', '2028-11-30');
    await treasurer.post(`/api/admin/members/${m.id}/verifications`, {
      what: 'certification',
      against: 'Level 2 certificate',
      certificationLevel: 'L2',
    });
    // The member's form sends every field; unchanged values void nothing.
    await m.client.patch('/api/membership/me', {
      associationNumber: 'NA-4002',
      associationExpires: '2028-11-30',
      certificationLevel: 'L2',
      certificationDate: null,
    });
    expect((await m.checkIn()).mayFly).toBe(true);
    const me = (await m.client.get('/api/membership/me')).body.membership;
    expect(me.associationVerifiedAt).toBe('2028-04-10T17:00:00.000Z');
    expect(me.certificationVerifiedAt).toBe('2028-04-10T17:00:00.000Z');

    await m.client.patch('/api/membership/me', { associationExpires: '2099-12-31' });
    const r = await m.checkIn();
    expect(r.mayFly).toBe(false);
    expect(r.association.answer).toBe('claimed');
    expect(r.certification.answer).toBe('verified');
    await m.client.patch('/api/membership/me', { certificationLevel: 'L3' });
    expect((await m.checkIn()).certification.answer).toBe('claimed');
    const after = (await m.client.get('/api/membership/me')).body.membership;
    expect(after).toEqual(expect.objectContaining({ associationVerifiedAt: null, certificationVerifiedAt: null }));
  });

  it('voids a verification when staff correct the value too', async () => {
    const m = await member('Corrected', { associationNumber: 'NA-4003', associationExpires: '2028-10-31' });
    await verifyAssociation(m.id, 'NA-4003', '2028-10-31');
    const res = await treasurer.patch(`/api/admin/members/${m.id}`, { associationNumber: 'NA-4004' });
    expect(res.body.verifications.association).toBeNull();
  });

  it('does not verify a value that changed since staff loaded it (409), nor without a document (400)', async () => {
    const m = await member('Stale', { associationNumber: 'NA-4005', associationExpires: '2028-09-30' });
    const stale = await verifyAssociation(m.id, 'NA-4005', '2028-08-31');
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('record_changed');
    const bare = await treasurer.post(`/api/admin/members/${m.id}/verifications`, {
      what: 'association',
      associationNumber: 'NA-4005',
      associationExpires: '2028-09-30',
    });
    expect(bare.status).toBe(400);
    expect(bare.body.error.fields).toHaveProperty('against');
    const none = await treasurer.post(`/api/admin/members/${m.id}/verifications`, {
      what: 'certification',
      against: 'nothing',
      certificationLevel: 'none',
    });
    expect(none.status).toBe(400);
    expect((await m.checkIn()).mayFly).toBe(false);
  });

  it('is not "may fly" with a verified association once it expires, nor once dues lapse', async () => {
    const m = await member('Expiring', { associationNumber: 'NA-4006', associationExpires: '2028-06-30' });
    await verifyAssociation(m.id, 'NA-4006', '2028-06-30');
    expect((await m.checkIn()).mayFly).toBe(true);
    clock.set('2028-07-02T17:00:00Z');
    expect(await m.checkIn()).toEqual(
      expect.objectContaining({ mayFly: false, association: expect.objectContaining({ answer: 'expired' }) }),
    );

    const d = await member('Lapsing', { associationNumber: 'NA-4007', associationExpires: '2030-06-30' });
    await verifyAssociation(d.id, 'NA-4007', '2030-06-30');
    clock.set('2029-03-01T17:00:00Z');
    expect(await d.checkIn()).toEqual(
      expect.objectContaining({
        status: 'lapsed',
        mayFly: false,
        dues: expect.objectContaining({ answer: 'not_current' }),
      }),
    );
  });

  it('answers a card whose record has no term as an unknown card: nothing about anyone, and no flying', async () => {
    const m = await member('Termless', { associationNumber: 'NA-4010', associationExpires: '2030-06-30' });
    await verifyAssociation(m.id, 'NA-4010', '2030-06-30');
    expect((await m.checkIn()).mayFly).toBe(true);
    await t.deps.db('memberships').where('id', m.id).update({ term_start: null, term_end: null });
    expect(await m.checkIn()).toEqual({
      status: 'unknown',
      memberNumber: null,
      name: null,
      mayFly: false,
      termEnd: null,
      dues: null,
      association: null,
      certification: null,
    });
  });

  it('marks claims and checks apart in the roster and its CSV', async () => {
    const m = await member('Rostered', {
      associationNumber: 'NA-4010',
      associationExpires: '2028-12-31',
      certificationLevel: 'L1',
    });
    await verifyAssociation(m.id, 'NA-4010', '2028-12-31');
    const q = encodeURIComponent(`Rostered ${tag}`);
    const [line] = (await treasurer.get(`/api/admin/members?q=${q}`)).body.items;
    expect(line).toEqual(expect.objectContaining({ associationVerified: true, certificationVerified: false }));
    const csv = (await treasurer.get(`/api/admin/members/export.csv?q=${q}`)).text.trim().split('\r\n');
    expect(csv[1]).toContain(',L1,No,NA-4010,2028-12-31,Yes,');
  });

  it('lets staff withdraw a verification', async () => {
    const m = await member('Withdrawn', { associationNumber: 'NA-4008', associationExpires: '2028-12-31' });
    await verifyAssociation(m.id, 'NA-4008', '2028-12-31');
    const res = await treasurer.delete(`/api/admin/members/${m.id}/verifications/association`);
    expect(res.status).toBe(200);
    expect(res.body.verifications.association).toBeNull();
    expect((await m.checkIn()).mayFly).toBe(false);
  });

  it('lets only the treasurer and admin verify', async () => {
    const m = await member('Guarded', { associationNumber: 'NA-4009', associationExpires: '2028-12-31' });
    const res = await rso.post(`/api/admin/members/${m.id}/verifications`, {
      what: 'association',
      against: 'card',
      associationNumber: 'NA-4009',
      associationExpires: '2028-12-31',
    });
    expect(res.status).toBe(403);
    expect(
      (
        await m.client.post(`/api/admin/members/${m.id}/verifications`, {
          what: 'association',
          against: 'card',
          associationNumber: 'NA-4009',
          associationExpires: '2028-12-31',
        })
      ).status,
    ).toBe(403);
  });
});
