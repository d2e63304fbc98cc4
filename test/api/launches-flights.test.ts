import { buildTestApp, fixedClock, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';
import { syntheticAltimeterLog } from '../../seeds/05_launches';
import { createLaunch, memberWithCard } from './launch-fixtures';

const clock = fixedClock('2031-05-10T15:00:00Z');
let t: TestApp;
let rso: Client;
let launchId: number;

beforeAll(async () => {
  t = buildTestApp({ clock });
  rso = (await signedIn(t.app, t.deps.db, ['fan', 'range_officer'])).client;
  launchId = await createLaunch(rso, '2031-05-10', { ceilingMetres: 600 });
});
afterAll(() => t.close());

/** A member checked in at today's launch. */
async function checkedIn(opts: { certificationLevel?: string } = {}) {
  const m = await memberWithCard(t, opts);
  expect((await rso.post(`/api/launches/${launchId}/check-in`, { token: m.token })).status).toBe(200);
  return m;
}

const card = (over: Record<string, unknown> = {}) => ({
  rocketName: 'Filament Falcon',
  liftoffMassGrams: 120,
  motors: ['C6-5'],
  expectedAltitudeMetres: 200,
  recovery: 'parachute',
  ...over,
});

/** Files a card and answers the flight. */
async function file(client: Client, over: Record<string, unknown> = {}) {
  const res = await client.post(`/api/launches/${launchId}/flights`, card(over));
  expect(res.status).toBe(201);
  return res.body.flight;
}

describe('POST /api/launches/:id/flights', () => {
  it('answers 201 with the parsed motors, thrust-to-weight and warnings', async () => {
    const m = await checkedIn();
    const res = await m.client.post(`/api/launches/${launchId}/flights`, card());
    expect(res.status).toBe(201);
    expect(res.body.flight).toEqual(
      expect.objectContaining({ id: expect.any(Number), status: 'filed', warnings: expect.any(Array) }),
    );
    // C6-5: class C, 6 N average thrust, 5 s delay (the designation's own letters and numbers).
    expect(res.body.flight.motors).toEqual([
      expect.objectContaining({ designation: 'C6-5', impulseClass: 'C', averageThrustN: 6, delayS: 5 }),
    ]);
    // 6 N / (0.120 kg x 9.80665 m/s^2) = 5.10 (standard gravity, CGPM 1901).
    expect(res.body.flight.thrustToWeight).toBeCloseTo(5.1, 1);
    expect(res.body.flight.warnings).toEqual([]);
  });

  it('warns in words for a low thrust-to-weight and an altitude above the launch ceiling', async () => {
    const m = await checkedIn();
    const flight = await file(m.client, { liftoffMassGrams: 250, expectedAltitudeMetres: 800 });
    // 6 N / (0.250 kg x 9.80665) = 2.45, below 5:1 (common practice, no source); 800 m is above the 600 m ceiling.
    expect(flight.thrustToWeight).toBeCloseTo(2.45, 1);
    expect(flight.warnings.map((w: { code: string }) => w.code).sort()).toEqual([
      'above_ceiling',
      'low_thrust_to_weight',
    ]);
    for (const w of flight.warnings) expect(w.message.length).toBeGreaterThan(20);
    expect(flight.status).toBe('filed');
  });

  it('answers 400 naming the motor it cannot read', async () => {
    const m = await checkedIn();
    const res = await m.client.post(`/api/launches/${launchId}/flights`, card({ motors: ['C6-5', 'banana'] }));
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['motors.1']);
  });

  it('answers 400 for missing fields and 409 to a member not checked in', async () => {
    const m = await checkedIn();
    const bad = await m.client.post(`/api/launches/${launchId}/flights`, { motors: [] });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(
      expect.arrayContaining(['rocketName', 'liftoffMassGrams', 'motors']),
    );
    const stranger = await memberWithCard(t);
    const res = await stranger.client.post(`/api/launches/${launchId}/flights`, card());
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('not_checked_in');
  });
});

describe('POST /api/admin/flights/:id/decision', () => {
  it('approves a card within the flyer certification, once across ten clicks', async () => {
    const m = await checkedIn();
    const flight = await file(m.client);
    const answers = await Promise.all(
      Array.from({ length: 10 }, () => rso.post(`/api/admin/flights/${flight.id}/decision`, { approve: true })),
    );
    expect(answers.map((a) => a.status).sort()).toEqual([200, ...Array(9).fill(409)]);
    expect((await new Client(t.app).get(`/api/flights/${flight.id}`)).body.flight.status).toBe('approved');
  });

  it('answers 409 not_certified for a motor class beyond the verified level, and approves it at a level that allows it', async () => {
    const none = await checkedIn();
    const hp = await file(none.client, { liftoffMassGrams: 1800, motors: ['H128W-M'], expectedAltitudeMetres: 500 });
    // H128W-M: class H, 128 N average, an adjustable medium delay without a number.
    expect(hp.motors[0]).toEqual(
      expect.objectContaining({ impulseClass: 'H', averageThrustN: 128, delayS: null, plugged: false }),
    );
    expect(hp.needsHighPower).toBe(true);
    expect(hp.warnings.map((w: { code: string }) => w.code)).toEqual(
      expect.arrayContaining(['high_power', 'beyond_certification']),
    );
    const refused = await rso.post(`/api/admin/flights/${hp.id}/decision`, { approve: true });
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('not_certified');
    expect((await new Client(t.app).get(`/api/flights/${hp.id}`)).body.flight.status).toBe('filed');
    const l1 = await checkedIn({ certificationLevel: 'L1' });
    const ok = await file(l1.client, { liftoffMassGrams: 1800, motors: ['H128W-M'], expectedAltitudeMetres: 500 });
    expect(ok.warnings.map((w: { code: string }) => w.code)).not.toContain('beyond_certification');
    expect((await rso.post(`/api/admin/flights/${ok.id}/decision`, { approve: true })).status).toBe(200);
  });

  it('sends a card back only with a reason', async () => {
    const m = await checkedIn();
    const flight = await file(m.client);
    const bare = await rso.post(`/api/admin/flights/${flight.id}/decision`, { approve: false });
    expect(bare.status).toBe(400);
    expect(bare.body.error.fields.reason).toBeDefined();
    const res = await rso.post(`/api/admin/flights/${flight.id}/decision`, {
      approve: false,
      reason: 'Fins loose; re-glue and file again.',
    });
    expect(res.status).toBe(200);
    expect(res.body.flight).toEqual(
      expect.objectContaining({ status: 'sent_back', decisionReason: 'Fins loose; re-glue and file again.' }),
    );
  });

  it('is refused to a member', async () => {
    const m = await checkedIn();
    const flight = await file(m.client);
    expect((await m.client.post(`/api/admin/flights/${flight.id}/decision`, { approve: true })).status).toBe(403);
  });
});

describe('POST /api/admin/flights/:id/outcome', () => {
  it('records the outcome of a cleared flight and refuses one still waiting', async () => {
    const m = await checkedIn();
    const flight = await file(m.client);
    expect((await rso.post(`/api/admin/flights/${flight.id}/outcome`, { outcome: 'recovered' })).body.error.code).toBe(
      'not_cleared',
    );
    await rso.post(`/api/admin/flights/${flight.id}/decision`, { approve: true });
    expect((await rso.post(`/api/admin/flights/${flight.id}/outcome`, { outcome: 'sideways' })).status).toBe(400);
    const res = await rso.post(`/api/admin/flights/${flight.id}/outcome`, {
      outcome: 'tree',
      notes: 'Second poplar from the gate.',
    });
    expect(res.status).toBe(200);
    expect(res.body.flight).toEqual(
      expect.objectContaining({
        status: 'flown',
        outcome: 'tree',
        outcomeLabel: 'Caught in a tree',
        outcomeNotes: 'Second poplar from the gate.',
      }),
    );
  });
});

describe('GET /api/admin/launches/:id/queue', () => {
  it('groups the cards by pad and carries the caution', async () => {
    const m = await checkedIn();
    const a = await file(m.client, { pad: 'P3' });
    const res = await rso.get(`/api/admin/launches/${launchId}/queue`);
    expect(res.status).toBe(200);
    expect(res.body.caution).toMatch(/range safety officer decides/);
    const pad = res.body.pads.find((p: { pad: string | null }) => p.pad === 'P3');
    expect(pad.items.map((i: { id: number }) => i.id)).toContain(a.id);
  });
});

/** A flown card of a fresh member. */
async function flown() {
  const m = await checkedIn();
  const flight = await file(m.client);
  await rso.post(`/api/admin/flights/${flight.id}/decision`, { approve: true });
  await rso.post(`/api/admin/flights/${flight.id}/outcome`, { outcome: 'recovered' });
  return { m, flight };
}

// Boost at 50 m/s^2 for 1.5 s, coast under standard gravity, descend at 5 m/s: apogee 56.25 + 75^2 / (2 x 9.80665)
// = 343.05 m at 1.5 + 75 / 9.80665 = 9.15 s, fastest climb 75 m/s (constant-acceleration kinematics, analytic).
const LOG = syntheticAltimeterLog({ boostMps2: 50, burnS: 1.5, descentMps: 5 });

describe('POST /api/flights/:id/data', () => {
  it('analyses the log, answers 201 with the summary and shows it on the flight page', async () => {
    const { m, flight } = await flown();
    const res = await m.client.agent
      .post(`/api/flights/${flight.id}/data`)
      .set('X-CSRF-Token', await m.client.token())
      .attach('log', Buffer.from(LOG), 'flight.csv');
    expect(res.status).toBe(201);
    const s = res.body.summary;
    expect(Math.abs(s.apogeeMetres - 343.05) / 343.05).toBeLessThan(0.01);
    expect(Math.abs(s.apogeeAtSeconds - 9.15) / 9.15).toBeLessThan(0.01);
    expect(Math.abs(s.maxSpeedMps - 75) / 75).toBeLessThan(0.01);
    expect(Math.abs(s.descentRateMps - 5) / 5).toBeLessThan(0.01);
    expect(s.samples).toBe(LOG.trim().split('\n').length - 1);
    const page = await new Client(t.app).get(`/api/flights/${flight.id}`);
    expect(page.body.data.summary).toEqual(res.body.summary);
    expect(page.body.data.series.length).toBeGreaterThan(10);
    expect(page.body.data.series.length).toBeLessThanOrEqual(1000);
    expect(page.body.data.events.map((e: { kind: string }) => e.kind)).toEqual(
      expect.arrayContaining(['liftoff', 'apogee', 'landing']),
    );
    expect(page.body.data.mapping.pressure).toEqual({ column: 'pressure_pa', unit: 'Pa' });
    expect(page.body.caution).toMatch(/safety code/);
  });

  it('answers 400 for a file it cannot map and without a file', async () => {
    const { m, flight } = await flown();
    const csrf = await m.client.token();
    const junk = await m.client.agent
      .post(`/api/flights/${flight.id}/data`)
      .set('X-CSRF-Token', csrf)
      .attach('log', Buffer.from('a,b\n1,2\n'), 'junk.csv');
    expect(junk.status).toBe(400);
    expect(junk.body.error.code).toBe('unmappable_log');
    expect(junk.body.error.message).toBeTruthy();
    const none = await m.client.agent
      .post(`/api/flights/${flight.id}/data`)
      .set('X-CSRF-Token', csrf)
      .field('columns', '{}');
    expect(none.status).toBe(400);
    expect(none.body.error.fields.log).toBeDefined();
    const badColumns = await m.client.agent
      .post(`/api/flights/${flight.id}/data`)
      .set('X-CSRF-Token', csrf)
      .field('columns', 'not json')
      .attach('log', Buffer.from(LOG), 'f.csv');
    expect(badColumns.status).toBe(400);
    expect(badColumns.body.error.fields.columns).toBeDefined();
    const wrongUnit = await m.client.agent
      .post(`/api/flights/${flight.id}/data`)
      .set('X-CSRF-Token', csrf)
      .field(
        'columns',
        JSON.stringify({ time: { column: 'time_s', unit: 'min' }, pressure: { column: 'pressure_pa', unit: 'Pa' } }),
      )
      .attach('log', Buffer.from(LOG), 'f.csv');
    expect(wrongUnit.status).toBe(400);
    expect(wrongUnit.body.error.fields['columns.time.unit']).toBeDefined();
    // A mapping that names the columns works where the header names alone would not.
    const renamed = LOG.replace('time_s,pressure_pa', 'col1,col2');
    const mapped = await m.client.agent
      .post(`/api/flights/${flight.id}/data`)
      .set('X-CSRF-Token', csrf)
      .field(
        'columns',
        JSON.stringify({ time: { column: 'col1', unit: 's' }, pressure: { column: 'col2', unit: 'Pa' } }),
      )
      .attach('log', Buffer.from(renamed), 'f.csv');
    expect(mapped.status).toBe(201);
  });

  it('answers 400 for more than 200,000 rows', async () => {
    const { m, flight } = await flown();
    const rows = [
      'time_s,pressure_pa,temp_c',
      ...Array.from({ length: 200_001 }, (_v, i) => `${i / 100},98000,20`),
    ].join('\n');
    const res = await m.client.agent
      .post(`/api/flights/${flight.id}/data`)
      .set('X-CSRF-Token', await m.client.token())
      .attach('log', Buffer.from(rows), 'long.csv');
    expect(res.status).toBe(400);
    expect(res.body.error.fields.log).toMatch(/200,000/);
  });

  it('is refused to another member and for a card not yet flown', async () => {
    const { flight } = await flown();
    const other = await signedIn(t.app, t.deps.db, ['fan', 'member']);
    const res = await other.client.agent
      .post(`/api/flights/${flight.id}/data`)
      .set('X-CSRF-Token', await other.client.token())
      .attach('log', Buffer.from(LOG), 'f.csv');
    expect(res.status).toBe(403);
    const m = await checkedIn();
    const waiting = await file(m.client);
    const early = await m.client.agent
      .post(`/api/flights/${waiting.id}/data`)
      .set('X-CSRF-Token', await m.client.token())
      .attach('log', Buffer.from(LOG), 'f.csv');
    expect(early.status).toBe(409);
  });
});

describe('GET /api/account/flights', () => {
  it('answers the logbook: flights by date, motors by class, total impulse and best altitude', async () => {
    const { m, flight } = await flown();
    await m.client.agent
      .post(`/api/flights/${flight.id}/data`)
      .set('X-CSRF-Token', await m.client.token())
      .attach('log', Buffer.from(LOG), 'flight.csv');
    const second = await file(m.client, { motors: ['B6-4'], liftoffMassGrams: 80 });
    await rso.post(`/api/admin/flights/${second.id}/decision`, { approve: true });
    await rso.post(`/api/admin/flights/${second.id}/outcome`, { outcome: 'lost' });
    const res = await m.client.get('/api/account/flights');
    expect(res.status).toBe(200);
    expect(res.body.items.map((f: { id: number }) => f.id).sort()).toEqual([flight.id, second.id].sort());
    expect(res.body.totals.motorsByClass).toEqual({ B: 1, C: 1 });
    // Classes double per letter: B is 2.51-5.00 N s, C 5.01-10.00 N s (from memory).
    expect(res.body.totals.totalImpulseNs.max).toBeCloseTo(15, 1);
    expect(res.body.totals.bestAltitude.flightId).toBe(flight.id);
  });
});

describe('GET /api/launches/:id/results', () => {
  it('lists the flown cards, the highest and the outcomes', async () => {
    const res = await new Client(t.app).get(`/api/launches/${launchId}/results`);
    expect(res.status).toBe(200);
    expect(res.body.flights.every((f: { status: string }) => f.status === 'flown')).toBe(true);
    expect(res.body.outcomes.recovered).toBeGreaterThan(0);
    expect(res.body.highest).not.toBeNull();
  });
});
