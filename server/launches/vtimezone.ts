import { offsetMinutes } from '../../contracts/dates/club-dates';

const pad = (n: number, w = 2) => String(Math.abs(n)).padStart(w, '0');
const utcOffset = (min: number) =>
  `${min < 0 ? '-' : '+'}${pad(Math.floor(Math.abs(min) / 60))}${pad(Math.abs(min) % 60)}`;
const localStamp = (instantMs: number, offsetMin: number) => {
  const d = new Date(instantMs + offsetMin * 60000);
  return `${d.getUTCFullYear()}${pad(d.getUTCMonth() + 1)}${pad(d.getUTCDate())}T${pad(d.getUTCHours())}${pad(d.getUTCMinutes())}${pad(d.getUTCSeconds())}`;
};

/** Every offset change of a zone in a year: the instant and the offsets before and after. */
function transitions(timeZone: string, year: number): { at: number; from: number; to: number }[] {
  const out: { at: number; from: number; to: number }[] = [];
  const end = Date.UTC(year + 1, 0, 1);
  // Steps of six hours: a zone's offset changes at most a few times a year, never twice within six hours.
  const STEP = 6 * 3600000;
  for (let t = Date.UTC(year, 0, 1); t < end; t += STEP) {
    const before = offsetMinutes(new Date(t), timeZone);
    const after = offsetMinutes(new Date(t + STEP), timeZone);
    if (before === after) continue;
    // Narrow the change down to the minute.
    let lo = t;
    let hi = t + STEP;
    while (hi - lo > 60000) {
      const mid = lo + Math.floor((hi - lo) / 120000) * 60000;
      if (offsetMinutes(new Date(mid), timeZone) === before) lo = mid;
      else hi = mid;
    }
    out.push({ at: hi, from: before, to: after });
  }
  return out;
}

/**
 * A VTIMEZONE (RFC 5545 3.6.5) for the years given, built from the platform's time zone data: one STANDARD or
 * DAYLIGHT part per actual change, so no recurrence rule has to be right for every zone.
 */
export function vtimezone(timeZone: string, years: number[]): string {
  const lines = ['BEGIN:VTIMEZONE', `TZID:${timeZone}`];
  const changes = [...new Set(years)].sort().flatMap((y) => transitions(timeZone, y));
  if (changes.length === 0) {
    const off = offsetMinutes(new Date(Date.UTC(Math.min(...years, 1970), 0, 1)), timeZone);
    lines.push(
      'BEGIN:STANDARD',
      'DTSTART:19700101T000000',
      `TZOFFSETFROM:${utcOffset(off)}`,
      `TZOFFSETTO:${utcOffset(off)}`,
      'END:STANDARD',
    );
  }
  for (const c of changes) {
    const kind = c.to > c.from ? 'DAYLIGHT' : 'STANDARD';
    lines.push(
      `BEGIN:${kind}`,
      `DTSTART:${localStamp(c.at, c.from)}`,
      `TZOFFSETFROM:${utcOffset(c.from)}`,
      `TZOFFSETTO:${utcOffset(c.to)}`,
      `END:${kind}`,
    );
  }
  lines.push('END:VTIMEZONE');
  return lines.join('\r\n');
}
