import { ClubCalendar } from '../../server/platform/club-calendar';

const WPG = 'America/Winnipeg';
const at = (iso: string) => new ClubCalendar({ now: () => new Date(iso) }, WPG);

// Offsets as in test/unit/club-dates.test.ts, which cites the IANA tz database (file `northamerica`, "Rule Canada
// 2007 max"): America/Winnipeg is -06:00 in standard time and -05:00 in daylight time; 2026 switches forward on
// 2026-03-08 and back on 2026-11-01.
describe('ClubCalendar.today in America/Winnipeg', () => {
  it('is still yesterday at 23:30 club time, though UTC has moved on', () => {
    expect(at('2026-01-16T05:30:00Z').today()).toBe('2026-01-15'); // 23:30 -06:00
  });

  it('turns over at club midnight: 00:30 club time is the new date', () => {
    expect(at('2026-01-16T06:30:00Z').today()).toBe('2026-01-16'); // 00:30 -06:00
  });

  it('uses the daylight offset on the evening of the spring switch day', () => {
    expect(at('2026-03-09T04:30:00Z').today()).toBe('2026-03-08'); // 23:30 -05:00
    // A fixed -06:00 would read 23:30 on the 8th here; in daylight time it is 00:30 on the 9th.
    expect(at('2026-03-09T05:30:00Z').today()).toBe('2026-03-09');
  });

  it('uses the standard offset again after the autumn switch day', () => {
    expect(at('2026-11-02T05:30:00Z').today()).toBe('2026-11-01'); // 23:30 -06:00
    expect(at('2026-11-02T06:30:00Z').today()).toBe('2026-11-02'); // 00:30 -06:00
    // On the switch day itself, 00:30 is still daylight time (-05:00).
    expect(at('2026-11-01T05:30:00Z').today()).toBe('2026-11-01');
  });

  it('reads the clock it was given each time it is asked, not once', () => {
    let now = new Date('2026-01-16T05:30:00Z');
    const calendar = new ClubCalendar({ now: () => now }, WPG);
    expect(calendar.today()).toBe('2026-01-15');
    now = new Date('2026-01-16T06:30:00Z');
    expect(calendar.today()).toBe('2026-01-16');
  });
});
