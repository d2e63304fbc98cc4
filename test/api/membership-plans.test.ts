import { buildTestApp, fixedClock, type TestApp } from '../helpers/test-app';
import { signedIn, type Client } from '../helpers/users';

// 2031 keeps these memberships clear of the other membership files' daily jobs.
const clock = fixedClock('2031-04-08T17:00:00Z');
let t: TestApp;
let treasurer: Client;
const tag = Date.now().toString(36);

beforeAll(async () => {
  t = buildTestApp({ clock });
  treasurer = (await signedIn(t.app, t.deps.db, ['fan', 'treasurer'])).client;
});
afterAll(() => t.close());

interface PlanBody {
  id: number;
  code: string;
  name: string;
  description: string;
  eligibility: string;
  duesCents: number;
  joiningFeeCents: number;
  active: boolean;
  sortOrder: number;
}

const publicPlans = async (): Promise<PlanBody[]> => (await treasurer.get('/api/membership/plans')).body.items;

async function join(planId: number, certificationLevel: string) {
  const s = await signedIn(t.app, t.deps.db);
  const res = await s.client.post('/api/membership', {
    planId,
    profile: {
      legalName: `Ottilie Brandvold ${tag}`,
      dateOfBirth: '1984-02-11',
      address: '3 Quarter Section Road, Gopher Flats, MB',
      phone: '204-555-0190',
      emergencyContact: 'Sten 204-555-0191',
      certificationLevel,
    },
    waiverVersion: '2026-1',
    paymentToken: 'tok_visa',
  });
  return res;
}

describe('POST /api/admin/members/plans', () => {
  it('adds a plan that members then see with its dues and joining fee', async () => {
    const res = await treasurer.post('/api/admin/members/plans', {
      code: `Ret-${tag}`,
      name: 'Retired flyer',
      description: 'Over 65 on the first day of the term.',
      duesCents: 2500,
      joiningFeeCents: 1000,
      sortOrder: 9,
    });
    expect(res.status).toBe(201);
    expect(res.body.plan).toEqual(
      expect.objectContaining({
        code: `ret-${tag}`,
        eligibility: 'any',
        duesCents: 2500,
        joiningFeeCents: 1000,
        active: true,
        sortOrder: 9,
      }),
    );
    expect((await publicPlans()).find((p) => p.id === res.body.plan.id)).toEqual(
      expect.objectContaining({ name: 'Retired flyer', duesCents: 2500, joiningFeeCents: 1000 }),
    );
  });

  it('answers 409 beside the code for a code already taken, also when two staff add it at once', async () => {
    const code = `dup-${tag}`;
    const body = { code, name: 'Crew', duesCents: 1500 };
    const both = await Promise.all([
      treasurer.post('/api/admin/members/plans', body),
      treasurer.post('/api/admin/members/plans', body),
    ]);
    expect(both.map((r) => r.status).sort()).toEqual([201, 409]);
    const again = await treasurer.post('/api/admin/members/plans', { ...body, code: code.toUpperCase() });
    expect(again.status).toBe(409);
    expect(again.body.error.fields.code).toBe('A plan with that code exists.');
    expect(await t.deps.db('membership_plans').where('code', code)).toHaveLength(1);
  });

  it('answers 400 beside each amount that is negative or not whole cents', async () => {
    const res = await treasurer.post('/api/admin/members/plans', {
      code: `bad-${tag}`,
      name: 'Bad',
      duesCents: -100,
      joiningFeeCents: 12.5,
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual(
      expect.objectContaining({ duesCents: 'Cannot be negative.', joiningFeeCents: 'Amounts are whole cents.' }),
    );
    expect(await t.deps.db('membership_plans').where('code', `bad-${tag}`)).toHaveLength(0);
  });
});

describe('PATCH /api/admin/members/plans/:id', () => {
  it('changes only the fields sent', async () => {
    const created = (
      await treasurer.post('/api/admin/members/plans', {
        code: `keep-${tag}`,
        name: 'Crew',
        description: 'Range crew.',
        duesCents: 1500,
        joiningFeeCents: 500,
        active: false,
        sortOrder: 7,
      })
    ).body.plan as PlanBody;
    const res = await treasurer.patch(`/api/admin/members/plans/${created.id}`, { duesCents: 1800 });
    expect(res.status).toBe(200);
    expect(res.body.plan).toEqual({ ...created, duesCents: 1800 });
  });

  it('switches a plan off: gone from the join form and refused there, still listed for staff, and back on', async () => {
    const plan = (
      await treasurer.post('/api/admin/members/plans', { code: `off-${tag}`, name: 'Winter', duesCents: 1200 })
    ).body.plan as PlanBody;
    expect((await treasurer.patch(`/api/admin/members/plans/${plan.id}`, { active: false })).body.plan.active).toBe(
      false,
    );
    expect((await publicPlans()).map((p) => p.id)).not.toContain(plan.id);
    expect(
      (await treasurer.get('/api/admin/members/plans')).body.items.find((p: PlanBody) => p.id === plan.id),
    ).toEqual(expect.objectContaining({ active: false }));
    const refused = await join(plan.id, 'none');
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields.planId).toBeDefined();
    await treasurer.patch(`/api/admin/members/plans/${plan.id}`, { active: true });
    expect((await publicPlans()).map((p) => p.id)).toContain(plan.id);
  });

  it('keeps the code and who may hold the plan, and answers 404 for an unknown plan', async () => {
    const plan = (
      await treasurer.post('/api/admin/members/plans', {
        code: `fixed-${tag}`,
        name: 'Junior crew',
        eligibility: 'junior',
        duesCents: 900,
      })
    ).body.plan as PlanBody;
    const res = await treasurer.patch(`/api/admin/members/plans/${plan.id}`, {
      code: 'other',
      eligibility: 'any',
      name: 'Cadet crew',
    });
    expect(res.body.plan).toEqual(
      expect.objectContaining({ code: `fixed-${tag}`, eligibility: 'junior', name: 'Cadet crew' }),
    );
    expect((await treasurer.patch('/api/admin/members/plans/999999999', { name: 'Nobody' })).status).toBe(404);
  });
});

describe('PUT /api/admin/members/settings (certification levels)', () => {
  type Settings = { certificationLevels: { code: string; label: string }[] } & Record<string, unknown>;
  const put = (settings: Settings) => treasurer.put('/api/admin/members/settings', settings);
  const current = async (): Promise<Settings> => (await treasurer.get('/api/admin/members/settings')).body.settings;

  it('answers 400 beside the first code unless the list starts with "none", and stores nothing', async () => {
    const s = await current();
    const [none, ...rest] = s.certificationLevels;
    for (const levels of [rest, [...rest, none]]) {
      const res = await put({ ...s, certificationLevels: levels });
      expect(res.status).toBe(400);
      expect(res.body.error.fields['certificationLevels.0.code']).toMatch(/first level must be "none"/);
    }
    expect((await current()).certificationLevels).toEqual(s.certificationLevels);
  });

  it('answers 400 beside a code given twice, whatever its case', async () => {
    const s = await current();
    const res = await put({
      ...s,
      certificationLevels: [...s.certificationLevels, { code: 'l1', label: 'Level one again' }],
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields[`certificationLevels.${s.certificationLevels.length}.code`]).toBe(
      'This code is already in the list.',
    );
  });

  it('adds a level members can then record, and refuses to drop it while a member holds it', async () => {
    const s = await current();
    const code = `T${tag}`.slice(0, 16);
    const adult = (await publicPlans()).find((p) => p.code === 'adult')!;
    try {
      expect(
        (await put({ ...s, certificationLevels: [...s.certificationLevels, { code, label: 'Test level' }] })).status,
      ).toBe(200);
      const joined = await join(adult.id, code);
      expect(joined.status).toBe(201);
      const member = await t.deps.db('memberships').where('certification_level', code).first();
      const dropped = await put(s);
      expect(dropped.status).toBe(409);
      expect(dropped.body.error.fields.certificationLevels).toBe(`Still held: ${code} (1 member).`);
      expect((await current()).certificationLevels.map((l) => l.code)).toContain(code);
      await treasurer.patch(`/api/admin/members/${member.id}`, { certificationLevel: 'none' });
      expect((await put(s)).status).toBe(200);
      expect((await current()).certificationLevels).toEqual(s.certificationLevels);
    } finally {
      await t.deps.db('memberships').where('certification_level', code).update({ certification_level: 'none' });
      await put(s);
    }
  });
});
