import { buildTestApp, fixedClock, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';
import { createLaunch, launchBody, memberWithCard } from './launch-fixtures';

// 2031 dates keep these launches clear of other suites' rows and the demo's.
const clock = fixedClock('2031-05-04T15:00:00Z');
let t: TestApp;
let rso: Client;
let admin: Client;

beforeAll(async () => {
  t = buildTestApp({ clock });
  rso = (await signedIn(t.app, t.deps.db, ['fan', 'range_officer'])).client;
  admin = (await signedIn(t.app, t.deps.db, ['admin'])).client;
});
afterAll(() => t.close());
beforeEach(() => clock.set('2031-05-04T15:00:00Z'));

const mails = (to: string, template: string) => t.deps.db('outbound_emails').where({ to_address: to, template });

describe('POST /api/admin/launches', () => {
  it('answers 201 with the launch in the shape of the issue', async () => {
    const res = await rso.post('/api/admin/launches', launchBody('2031-06-14', { title: 'June launch' }));
    expect(res.status).toBe(201);
    expect(res.body.launch).toEqual(
      expect.objectContaining({
        title: 'June launch',
        date: '2031-06-14',
        startsAt: '10:00',
        endsAt: '16:00',
        status: 'scheduled',
        ceilingMetres: 1500,
        rsvpCount: 0,
      }),
    );
    expect(res.body.launch.site).toEqual({
      name: 'Coulee Field',
      address: 'Range Road 12, Gopher Flats, MB',
      lat: 49.61,
      lon: -98.02,
    });
  });

  it('lets an admin do it too', async () => {
    expect((await admin.post('/api/admin/launches', launchBody('2031-06-15'))).status).toBe(201);
  });

  describe('when the body is wrong', () => {
    it('answers 400 naming each field', async () => {
      const res = await rso.post('/api/admin/launches', {
        title: '',
        date: '2031-02-30',
        startsAt: '25:00',
        endsAt: '9am',
        site: { name: '', lat: 120 },
      });
      expect(res.status).toBe(400);
      expect(Object.keys(res.body.error.fields)).toEqual(
        expect.arrayContaining(['title', 'date', 'startsAt', 'endsAt', 'site.name', 'site.lat']),
      );
    });

    it('answers 400 on endsAt when the window ends before it starts', async () => {
      const res = await rso.post(
        '/api/admin/launches',
        launchBody('2031-06-14', { startsAt: '15:00', endsAt: '09:00' }),
      );
      expect(res.status).toBe(400);
      expect(res.body.error.fields.endsAt).toMatch(/after/);
    });
  });
});

describe('PATCH /api/admin/launches/:id', () => {
  it('changes the fields sent and leaves the rest', async () => {
    const id = await createLaunch(rso, '2031-06-21');
    const res = await rso.patch(`/api/admin/launches/${id}`, { endsAt: '17:30', notes: 'Gate opens 09:30.' });
    expect(res.status).toBe(200);
    expect(res.body.launch).toEqual(
      expect.objectContaining({ startsAt: '10:00', endsAt: '17:30', notes: 'Gate opens 09:30.' }),
    );
  });

  it('answers 409 when the new end is before the stored start', async () => {
    const id = await createLaunch(rso, '2031-06-21');
    const res = await rso.patch(`/api/admin/launches/${id}`, { endsAt: '08:00' });
    expect(res.status).toBe(409);
    expect(res.body.error.fields.endsAt).toBeDefined();
  });
});

describe('GET /api/launches', () => {
  it('lists launches for anyone with status, site and the RSVP count', async () => {
    const id = await createLaunch(rso, '2031-07-05');
    const m = await memberWithCard(t);
    await m.client.post(`/api/launches/${id}/rsvp`, { going: true });
    const res = await new Client(t.app).get('/api/launches?from=2031-07-05&to=2031-07-05');
    expect(res.status).toBe(200);
    const item = res.body.items.find((i: { id: number }) => i.id === id);
    expect(item).toEqual(
      expect.objectContaining({
        id,
        date: '2031-07-05',
        startsAt: '10:00',
        endsAt: '16:00',
        status: 'scheduled',
        rsvpCount: 1,
      }),
    );
    expect(item.site.name).toBe('Coulee Field');
  });

  it('answers 400 for a date that is not one', async () => {
    expect((await rso.get('/api/launches?from=yesterday')).status).toBe(400);
  });
});

describe('POST /api/launches/:id/rsvp', () => {
  it('records going and not going, counting only going', async () => {
    const id = await createLaunch(rso, '2031-07-12');
    const a = await signedIn(t.app, t.deps.db, ['fan', 'member']);
    const b = await signedIn(t.app, t.deps.db, ['fan', 'member']);
    expect((await a.client.post(`/api/launches/${id}/rsvp`, { going: true })).body.launch.rsvpCount).toBe(1);
    expect((await b.client.post(`/api/launches/${id}/rsvp`, { going: true })).body.launch.rsvpCount).toBe(2);
    const changed = await b.client.post(`/api/launches/${id}/rsvp`, { going: false });
    expect(changed.status).toBe(200);
    expect(changed.body.launch.rsvpCount).toBe(1);
    expect((await a.client.get(`/api/launches/${id}`)).body.me).toEqual({ going: true, checkedIn: false });
  });

  it('answers 400 without going, 404 for no launch, 409 for a past or called-off launch', async () => {
    const a = await signedIn(t.app, t.deps.db, ['fan']);
    const past = await createLaunch(rso, '2031-05-01');
    const off = await createLaunch(rso, '2031-07-19');
    await rso.post(`/api/admin/launches/${off}/call-off`, { reason: 'Fire risk' });
    expect((await a.client.post(`/api/launches/${past}/rsvp`, {})).status).toBe(400);
    expect((await a.client.post('/api/launches/999999/rsvp', { going: true })).status).toBe(404);
    expect((await a.client.post(`/api/launches/${past}/rsvp`, { going: true })).body.error.code).toBe('launch_closed');
    expect((await a.client.post(`/api/launches/${off}/rsvp`, { going: true })).status).toBe(409);
  });
});

describe('POST /api/admin/launches/:id/call-off', () => {
  it('calls it off with the reason, raises the sequence and tells only those who said yes, once', async () => {
    const id = await createLaunch(rso, '2031-07-26');
    const yes = await signedIn(t.app, t.deps.db, ['fan', 'member']);
    const no = await signedIn(t.app, t.deps.db, ['fan', 'member']);
    await yes.client.post(`/api/launches/${id}/rsvp`, { going: true });
    await no.client.post(`/api/launches/${id}/rsvp`, { going: false });
    const res = await rso.post(`/api/admin/launches/${id}/call-off`, { reason: 'Gusts over 30 km/h' });
    expect(res.status).toBe(200);
    expect(res.body.launch).toEqual(
      expect.objectContaining({ status: 'called_off', callOffReason: 'Gusts over 30 km/h' }),
    );
    expect(res.body.notified).toBe(1);
    const sent = await mails(yes.user.email, 'launch-called-off');
    expect(sent).toHaveLength(1);
    expect(sent[0].text_body).toContain('Gusts over 30 km/h');
    expect(await mails(no.user.email, 'launch-called-off')).toHaveLength(0);
    expect((await t.deps.db('launches').where('id', id).first()).sequence).toBe(1);
    const again = await rso.post(`/api/admin/launches/${id}/call-off`, { reason: 'Still windy' });
    expect(again.status).toBe(409);
    expect(await mails(yes.user.email, 'launch-called-off')).toHaveLength(1);
  });

  it('answers one 200 and the rest 409 for ten clicks at once, with one notice', async () => {
    const id = await createLaunch(rso, '2031-08-02');
    const yes = await signedIn(t.app, t.deps.db, ['fan', 'member']);
    await yes.client.post(`/api/launches/${id}/rsvp`, { going: true });
    const answers = await Promise.all(
      Array.from({ length: 10 }, () => rso.post(`/api/admin/launches/${id}/call-off`, { reason: 'Airspace closed' })),
    );
    expect(answers.map((a) => a.status).sort()).toEqual([200, ...Array(9).fill(409)]);
    expect(await mails(yes.user.email, 'launch-called-off')).toHaveLength(1);
    expect((await t.deps.db('launches').where('id', id).first()).sequence).toBe(1);
  });

  it('answers 400 without a reason', async () => {
    const id = await createLaunch(rso, '2031-08-09');
    const res = await rso.post(`/api/admin/launches/${id}/call-off`, { reason: ' ' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.reason).toBeDefined();
  });
});

describe('POST /api/admin/launches/:id/done', () => {
  it('closes a scheduled launch once', async () => {
    const id = await createLaunch(rso, '2031-05-03');
    expect((await rso.post(`/api/admin/launches/${id}/done`)).body.launch.status).toBe('done');
    expect((await rso.post(`/api/admin/launches/${id}/done`)).status).toBe(409);
    expect((await rso.patch(`/api/admin/launches/${id}`, { title: 'Renamed' })).status).toBe(409);
  });
});

describe('the launch reminder job', () => {
  it('queues one reminder two days before for each yes, once however often it runs', async () => {
    const id = await createLaunch(rso, '2031-09-13');
    const yes = await signedIn(t.app, t.deps.db, ['fan', 'member']);
    const no = await signedIn(t.app, t.deps.db, ['fan', 'member']);
    await yes.client.post(`/api/launches/${id}/rsvp`, { going: true });
    await no.client.post(`/api/launches/${id}/rsvp`, { going: false });
    const job = t.app.jobs.find((j) => j.name === 'launch-reminders')!;
    clock.set('2031-09-10T15:00:00Z');
    await job.run();
    expect(await mails(yes.user.email, 'launch-reminder')).toHaveLength(0);
    clock.set('2031-09-11T15:00:00Z');
    await Promise.all([job.run(), job.run(), job.run()]);
    clock.set('2031-09-12T15:00:00Z');
    await job.run();
    const sent = await mails(yes.user.email, 'launch-reminder');
    expect(sent).toHaveLength(1);
    expect(sent[0].subject).toContain('Sep 13, 2031');
    expect(await mails(no.user.email, 'launch-reminder')).toHaveLength(0);
  });

  it('sends none for a called-off launch', async () => {
    const id = await createLaunch(rso, '2031-09-20');
    const yes = await signedIn(t.app, t.deps.db, ['fan', 'member']);
    await yes.client.post(`/api/launches/${id}/rsvp`, { going: true });
    await rso.post(`/api/admin/launches/${id}/call-off`, { reason: 'Fire ban' });
    clock.set('2031-09-18T15:00:00Z');
    await t.app.jobs.find((j) => j.name === 'launch-reminders')!.run();
    expect(await mails(yes.user.email, 'launch-reminder')).toHaveLength(0);
  });
});

describe('POST /api/launches/:id/check-in', () => {
  it('records attendance from the member card token, once', async () => {
    const id = await createLaunch(rso, '2031-05-04');
    const m = await memberWithCard(t, { name: 'Odalys Prairie' });
    const first = await rso.post(`/api/launches/${id}/check-in`, { token: m.token });
    expect(first.status).toBe(200);
    expect(first.body).toEqual(
      expect.objectContaining({
        checkedIn: true,
        alreadyCheckedIn: false,
        member: expect.objectContaining({ memberNumber: m.memberNumber, name: 'Odalys Prairie', status: 'active' }),
      }),
    );
    expect((await rso.post(`/api/launches/${id}/check-in`, { token: m.token })).body.alreadyCheckedIn).toBe(true);
    const list = await rso.get(`/api/admin/launches/${id}/attendance`);
    expect(list.body.items.map((a: { memberNumber: string }) => a.memberNumber)).toEqual([m.memberNumber]);
    expect((await m.client.get(`/api/launches/${id}`)).body.me.checkedIn).toBe(true);
  });

  it('answers 409 for a token that does not verify or dues that are not current, 400 without one', async () => {
    const id = await createLaunch(rso, '2031-05-04');
    const lapsed = await memberWithCard(t, { termEnd: '2030-12-31' });
    const m = await memberWithCard(t);
    const [v, n, at] = m.token.split('.');
    const tampered = `${v}.${n}.${Number(at) + 1}.${m.token.split('.')[3]}`;
    expect((await rso.post(`/api/launches/${id}/check-in`, { token: tampered })).body.error.code).toBe('unknown_card');
    expect((await rso.post(`/api/launches/${id}/check-in`, { token: lapsed.token })).body.error.code).toBe(
      'dues_not_current',
    );
    expect((await rso.post(`/api/launches/${id}/check-in`, {})).status).toBe(400);
    expect(await t.deps.db('launch_attendance').where('launch_id', id)).toHaveLength(0);
  });

  it('is refused to a member without the range officer role', async () => {
    const id = await createLaunch(rso, '2031-05-04');
    const m = await memberWithCard(t);
    expect((await m.client.post(`/api/launches/${id}/check-in`, { token: m.token })).status).toBe(403);
  });
});

describe('GET and PUT /api/admin/launches/settings', () => {
  it('answers the impulse classes per certification level and refuses a class that is not a letter', async () => {
    const res = await rso.get('/api/admin/launches/settings');
    expect(res.status).toBe(200);
    expect(res.body.classesByLevel.none).toEqual(['A', 'B', 'C', 'D', 'E', 'F', 'G']);
    expect(res.body.classesByLevel.L1).toEqual(expect.arrayContaining(['H', 'I']));
    // The club-wide value is only read back, never changed here: other suites read it.
    const bad = await rso.put('/api/admin/launches/settings', { classesByLevel: { none: ['A', 'Q7'] } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields['classesByLevel.none.1']).toBe('Use one letter per class.');
    const empty = await rso.put('/api/admin/launches/settings', { classesByLevel: { none: ['A'], L1: [] } });
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields).toEqual({ 'classesByLevel.L1': 'List at least one class.' });
  });
});
