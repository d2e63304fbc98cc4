/**
 * Every date and time a person reads, in one format: the club's locale (Canadian English), the club's time zone,
 * minutes and never seconds. "Mar 8, 2026", "Mar 8, 2026, 4:30 a.m.", "4:30 a.m.". CSV cells carry ISO 8601
 * instead ("2026-03-08T04:30-05:00"), in club time too, with the zone named in the column header.
 *
 * The offsets come from the IANA time zone database that the JavaScript engine ships (Intl), so server and pages
 * agree as long as both run a current tz database.
 */
export const CLUB_LOCALE = 'en-CA';

type Instant = Date | string;

const formats = new Map<string, Intl.DateTimeFormat>();
// Made on first use: a page's first formatter costs the engine's locale data, which a page without dates never needs.
function format(timeZone: string, style: 'date' | 'dateTime' | 'time' | 'month' | 'parts'): Intl.DateTimeFormat {
  const key = `${style} ${timeZone}`;
  let f = formats.get(key);
  if (!f) {
    const options: Intl.DateTimeFormatOptions =
      style === 'date'
        ? { dateStyle: 'medium' }
        : style === 'dateTime'
          ? { dateStyle: 'medium', timeStyle: 'short' }
          : style === 'time'
            ? { timeStyle: 'short' }
            : style === 'month'
              ? { month: 'short', year: 'numeric' }
              : {
                  hourCycle: 'h23',
                  year: 'numeric',
                  month: '2-digit',
                  day: '2-digit',
                  hour: '2-digit',
                  minute: '2-digit',
                  second: '2-digit',
                };
    f = new Intl.DateTimeFormat(style === 'parts' ? 'en-US' : CLUB_LOCALE, { ...options, timeZone });
    formats.set(key, f);
  }
  return f;
}

const toDate = (i: Instant) => (typeof i === 'string' ? new Date(i) : i);
const YMD = /^(\d{4})-(\d{2})-(\d{2})$/;

/** A calendar date (`YYYY-MM-DD`, already a club date) as people read it: "Mar 8, 2026". */
export function formatDay(ymd: string): string {
  const m = YMD.exec(ymd);
  if (!m) return ymd;
  return format('UTC', 'date').format(new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]), 12)));
}

const YM = /^(\d{4})-(\d{2})$/;

/** A calendar month (`YYYY-MM`, already a club month, as the books group by) as people read it: "Dec 2026". */
export function formatMonth(ym: string): string {
  const m = YM.exec(ym);
  if (!m) return ym;
  return format('UTC', 'month').format(new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, 15, 12)));
}

/** The club-time calendar date of an instant: "Mar 8, 2026". */
export function formatDate(instant: Instant, timeZone: string): string {
  return format(timeZone, 'date').format(toDate(instant));
}

/** An instant in club time, to the minute: "Mar 8, 2026, 4:30 a.m.". */
export function formatDateTime(instant: Instant, timeZone: string): string {
  return format(timeZone, 'dateTime').format(toDate(instant));
}

/** The club-time clock reading of an instant, to the minute: "4:30 a.m.". */
export function formatTime(instant: Instant, timeZone: string): string {
  return format(timeZone, 'time').format(toDate(instant));
}

/** A wall-clock time of day stored as `HH:MM` (launch windows), in the same words: "9:00 a.m.". */
export function formatClock(hhmm: string): string {
  const m = /^(\d{2}):(\d{2})$/.exec(hhmm);
  if (!m) return hhmm;
  return format('UTC', 'time').format(new Date(Date.UTC(2000, 0, 1, Number(m[1]), Number(m[2]))));
}

function wall(instant: Date, timeZone: string): { date: string; time: string; offsetMinutes: number } {
  const p = Object.fromEntries(
    format(timeZone, 'parts')
      .formatToParts(instant)
      .map((x) => [x.type, x.value]),
  );
  const date = `${p['year']}-${p['month']}-${p['day']}`;
  const time = `${p['hour']}:${p['minute']}`;
  const asUtc = Date.UTC(
    Number(p['year']),
    Number(p['month']) - 1,
    Number(p['day']),
    Number(p['hour']),
    Number(p['minute']),
    Number(p['second']),
  );
  return { date, time, offsetMinutes: Math.round((asUtc - Math.floor(instant.getTime() / 1000) * 1000) / 60000) };
}

/** Minutes east of UTC that `timeZone` observes at `instant` (Winnipeg in winter: -360), from the platform's zone data. */
export function offsetMinutes(instant: Date, timeZone: string): number {
  return wall(instant, timeZone).offsetMinutes;
}

/** The club-time calendar date of an instant as ISO 8601: "2026-03-08". */
export function isoDateInZone(instant: Instant, timeZone: string): string {
  return wall(toDate(instant), timeZone).date;
}

/** An instant as ISO 8601 in club time, to the minute, with its offset: "2026-03-08T04:30-05:00". */
export function isoInZone(instant: Instant, timeZone: string): string {
  const w = wall(toDate(instant), timeZone);
  const sign = w.offsetMinutes < 0 ? '-' : '+';
  const abs = Math.abs(w.offsetMinutes);
  return `${w.date}T${w.time}${sign}${String(Math.floor(abs / 60)).padStart(2, '0')}:${String(abs % 60).padStart(2, '0')}`;
}

/** The place a tz database zone is named after, in words: "America/Winnipeg" -> "Winnipeg". */
export function zoneCity(timeZone: string): string {
  return (timeZone.split('/').pop() ?? timeZone).replace(/_/g, ' ');
}

/** How pages say which clock their times follow: "club time (Winnipeg)". */
export function clubTimeInWords(timeZone: string): string {
  return `club time (${zoneCity(timeZone)})`;
}

/** A CSV column header naming the zone its dates are in: "Paid at (America/Winnipeg)". */
export function zonedHeader(label: string, timeZone: string): string {
  return `${label} (${timeZone})`;
}
