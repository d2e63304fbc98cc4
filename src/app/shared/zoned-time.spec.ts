import { wallTimeToIso } from './zoned-time';

// Offsets from the IANA time zone database as shipped in ICU (from memory): Winnipeg CST -06:00, CDT -05:00,
// 2026 spring change 2026-03-08 02:00 -> 03:00 and autumn change 2026-11-01 02:00 -> 01:00; Newfoundland -03:30.
describe('wallTimeToIso', () => {
  it('gives the club wall time with its standard or daylight offset', () => {
    expect(wallTimeToIso('2026-12-01T09:00', 'America/Winnipeg')).toBe('2026-12-01T09:00:00-06:00');
    expect(wallTimeToIso('2026-07-01T09:00', 'America/Winnipeg')).toBe('2026-07-01T09:00:00-05:00');
    expect(wallTimeToIso('2026-07-01T09:00', 'America/St_Johns')).toBe('2026-07-01T09:00:00-02:30');
    expect(wallTimeToIso('2026-12-01T09:00', 'America/St_Johns')).toBe('2026-12-01T09:00:00-03:30');
  });

  it('names the same instant as the wall time, either side of a change', () => {
    for (const local of ['2026-03-08T01:30', '2026-03-08T03:30', '2026-11-01T00:30', '2026-11-01T03:00']) {
      const iso = wallTimeToIso(local, 'America/Winnipeg');
      const shown = new Intl.DateTimeFormat('sv-SE', {
        timeZone: 'America/Winnipeg',
        dateStyle: 'short',
        timeStyle: 'short',
      }).format(new Date(iso));
      expect(shown.replace(' ', 'T')).toBe(local);
    }
  });

  it('gives nothing for an empty or malformed entry, so the server asks for the field', () => {
    expect(wallTimeToIso('', 'America/Winnipeg')).toBe('');
    expect(wallTimeToIso('2026-12-01', 'America/Winnipeg')).toBe('');
  });
});
