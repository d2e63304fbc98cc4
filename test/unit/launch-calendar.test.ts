import ICAL from 'ical.js';
import { launchCalendar } from '../../server/launches/launch-calendar';
import type { LaunchRow } from '../../server/launches/launch-repository';

const launch = (id: number, date: string, startsAt: string, endsAt: string): LaunchRow => ({
  id,
  uid: `00000000-0000-4000-8000-00000000000${id}`,
  title: `Launch ${id}`,
  launch_date: date,
  starts_at: startsAt,
  ends_at: endsAt,
  site_name: 'Field',
  site_address: null,
  site_lat: null,
  site_lon: null,
  ceiling_metres: null,
  waiver_version: null,
  notes: '',
  status: 'scheduled',
  call_off_reason: null,
  called_off_at: null,
  sequence: 0,
  updated_at: new Date('2031-01-01T00:00:00Z'),
});

/** The UTC start of each event, as ical.js reads it with the feed's own VTIMEZONE registered. */
function startsInUtc(timeZone: string, launches: LaunchRow[]): string[] {
  const text = launchCalendar(launches, {
    clubName: 'Club',
    timeZone,
    publicUrl: 'https://club.example',
    host: 'club.example',
    now: new Date('2031-01-01T00:00:00Z'),
  });
  const cal = new ICAL.Component(ICAL.parse(text));
  ICAL.TimezoneService.reset();
  ICAL.TimezoneService.register(cal.getFirstSubcomponent('vtimezone')!);
  return cal.getAllSubcomponents('vevent').map((v) => new ICAL.Event(v).startDate.toJSDate().toISOString());
}

describe('the launch feed in other time zones (parsed by ical.js)', () => {
  it('places times in a southern-hemisphere zone on both sides of its daylight time', () => {
    // Sydney keeps daylight time (UTC+11) in January and standard time (UTC+10) in July (IANA tz database, Australia/Sydney).
    expect(
      startsInUtc('Australia/Sydney', [
        launch(1, '2031-01-18', '09:00', '15:00'),
        launch(2, '2031-07-19', '09:00', '15:00'),
      ]),
    ).toEqual(['2031-01-17T22:00:00.000Z', '2031-07-18T23:00:00.000Z']);
  });

  it('places times in a zone without daylight time', () => {
    // Saskatchewan keeps Central standard time (UTC-6) all year (IANA tz database, America/Regina).
    expect(startsInUtc('America/Regina', [launch(3, '2031-06-14', '10:00', '16:00')])).toEqual([
      '2031-06-14T16:00:00.000Z',
    ]);
  });

  it('puts a January launch after the zone definition starts', () => {
    // Winnipeg in January: Central standard time, UTC-6 (IANA tz database, America/Winnipeg).
    expect(startsInUtc('America/Winnipeg', [launch(4, '2031-01-04', '11:00', '14:00')])).toEqual([
      '2031-01-04T17:00:00.000Z',
    ]);
  });
});
