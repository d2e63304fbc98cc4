import { offsetMinutes } from '@contracts/dates/club-dates';

/**
 * The instant, as ISO 8601 with its offset, at which the wall clock in `timeZone` reads `local`
 * ("2026-12-01T09:00", what a datetime-local input gives). Staff type run windows in the club's time, whatever
 * zone their own computer is in. A wall time skipped by a spring-forward change resolves to the later offset.
 */
export function wallTimeToIso(local: string, timeZone: string): string {
  const m = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})$/.exec(local);
  if (!m) return '';
  const wall = Date.UTC(+m[1], +m[2] - 1, +m[3], +m[4], +m[5]);
  // Two passes: the offset at the first guess may differ from the offset at the answer near a change.
  let offset = offsetMinutes(new Date(wall), timeZone);
  offset = offsetMinutes(new Date(wall - offset * 60000), timeZone);
  const sign = offset < 0 ? '-' : '+';
  const abs = Math.abs(offset);
  return `${local}:00${sign}${String(Math.floor(abs / 60)).padStart(2, '0')}:${String(abs % 60).padStart(2, '0')}`;
}
