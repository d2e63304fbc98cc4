/** Injected wherever "now" matters, so tests can fix the date. */
export interface Clock {
  now(): Date;
}

export const systemClock: Clock = { now: () => new Date() };

const dateFormats = new Map<string, Intl.DateTimeFormat>();

/** The calendar date (YYYY-MM-DD) of an instant in a time zone. */
export function dateInZone(instant: Date, timeZone: string): string {
  // Building a DateTimeFormat costs far more than using one (it showed in the checkout's profile): one per zone.
  let format = dateFormats.get(timeZone);
  if (!format)
    dateFormats.set(
      timeZone,
      (format = new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' })),
    );
  return format.format(instant);
}
