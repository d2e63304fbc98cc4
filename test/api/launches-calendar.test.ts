import ICAL from 'ical.js';
import { buildTestApp, fixedClock, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';
import { createLaunch } from './launch-fixtures';

const clock = fixedClock('2031-05-04T15:00:00Z');
let t: TestApp;
let rso: Client;

beforeAll(async () => {
  t = buildTestApp({ clock, env: { CLUB_TIME_ZONE: 'America/Winnipeg' } });
  rso = (await signedIn(t.app, t.deps.db, ['range_officer'])).client;
});
afterAll(() => t.close());

/** The feed parsed by ical.js (a general-purpose iCalendar library), its zone registered from the feed itself. */
async function feed() {
  const res = await new Client(t.app).get('/feeds/launches.ics');
  expect(res.status).toBe(200);
  expect(res.headers['content-type']).toMatch(/^text\/calendar/);
  const cal = new ICAL.Component(ICAL.parse(res.text));
  const zones = cal.getAllSubcomponents('vtimezone');
  expect(zones).toHaveLength(1);
  ICAL.TimezoneService.register(zones[0]);
  return { text: res.text, events: cal.getAllSubcomponents('vevent').map((v) => new ICAL.Event(v)) };
}

describe('GET /feeds/launches.ics (RFC 5545)', () => {
  it('has one VEVENT per launch with a stable UID and times in the club time zone', async () => {
    const summer = await createLaunch(rso, '2031-06-14', {
      title: 'Summer feed launch',
      startsAt: '10:00',
      endsAt: '16:30',
    });
    const winter = await createLaunch(rso, '2031-12-13', {
      title: 'Winter feed launch',
      startsAt: '11:00',
      endsAt: '14:00',
    });
    const first = await feed();
    const byTitle = (events: ICAL.Event[], title: string) => events.filter((e) => e.summary === title);
    const s = byTitle(first.events, 'Summer feed launch');
    const w = byTitle(first.events, 'Winter feed launch');
    expect(s).toHaveLength(1);
    expect(w).toHaveLength(1);
    expect(s[0].startDate.zone?.tzid).toBe('America/Winnipeg');
    // Winnipeg keeps Central daylight time (UTC-5) in June and Central standard time (UTC-6) in December
    // (IANA time zone database, America/Winnipeg; North American daylight time from the second Sunday of March
    // to the first Sunday of November).
    expect(s[0].startDate.toJSDate().toISOString()).toBe('2031-06-14T15:00:00.000Z');
    expect(s[0].endDate.toJSDate().toISOString()).toBe('2031-06-14T21:30:00.000Z');
    expect(w[0].startDate.toJSDate().toISOString()).toBe('2031-12-13T17:00:00.000Z');
    expect(first.text).toMatch(/DTSTART;TZID=America\/Winnipeg:20310614T100000\r\n/);
    const second = await feed();
    expect(byTitle(second.events, 'Summer feed launch')[0].uid).toBe(s[0].uid);
    expect(s[0].uid).not.toBe(w[0].uid);
    expect(s[0].component.getFirstPropertyValue('status')).toBe('CONFIRMED');
    void summer;
    void winter;
  });

  it('shows a called-off launch as STATUS:CANCELLED with its SEQUENCE raised and the same UID', async () => {
    const id = await createLaunch(rso, '2031-07-05', { title: 'Feed launch to call off' });
    const find = async () => (await feed()).events.find((e) => e.summary.endsWith('Feed launch to call off'))!;
    const before = await find();
    await rso.post(`/api/admin/launches/${id}/call-off`, { reason: 'Fire risk' });
    const after = await find();
    expect(after.uid).toBe(before.uid);
    expect(after.component.getFirstPropertyValue('status')).toBe('CANCELLED');
    expect(after.sequence).toBeGreaterThan(before.sequence);
    expect(after.description).toContain('Fire risk');
  });
});
