import ical, { ICalEventStatus } from 'ical-generator';
import type { LaunchRow } from './launch-repository';
import { vtimezone } from './vtimezone';

/** What the feed needs besides the launches. */
export interface CalendarContext {
  clubName: string;
  timeZone: string;
  publicUrl: string;
  host: string;
  now: Date;
}

/**
 * The club's launches as an iCalendar file (RFC 5545): one VEVENT per launch with its stable UID, start and end in
 * the club's time zone (TZID with its VTIMEZONE), a called-off launch as STATUS:CANCELLED with its SEQUENCE raised.
 */
export function launchCalendar(launches: LaunchRow[], c: CalendarContext): string {
  const cal = ical({
    name: `${c.clubName} launches`,
    prodId: { company: 'Padside', product: 'launch-calendar', language: 'EN' },
    url: `${c.publicUrl}/launches`,
    ttl: 3600,
  });
  for (const l of launches) {
    cal.createEvent({
      id: `launch-${l.uid}@${c.host}`,
      // A wall-clock time without an offset: ical-generator writes these fields as they are beside the TZID.
      start: `${l.launch_date}T${l.starts_at}:00`,
      end: `${l.launch_date}T${l.ends_at}:00`,
      timezone: c.timeZone,
      stamp: c.now,
      lastModified: l.updated_at,
      sequence: l.sequence,
      status: l.status === 'called_off' ? ICalEventStatus.CANCELLED : ICalEventStatus.CONFIRMED,
      summary: l.status === 'called_off' ? `Called off: ${l.title}` : l.title,
      description: [
        l.status === 'called_off' && l.call_off_reason ? `Called off: ${l.call_off_reason}` : '',
        l.notes,
        "The range safety officer decides on the day; fly under your national association's safety code and local aviation and fire rules.",
      ]
        .filter(Boolean)
        .join('\n\n'),
      location: [l.site_name, l.site_address].filter(Boolean).join(', '),
      url: `${c.publicUrl}/launches/${l.id}`,
    });
  }
  const text = cal.toString();
  if (launches.length === 0) return text;
  // The zone's definition for every year the feed covers (and the year before, so January events have one).
  const years = launches.map((l) => Number(l.launch_date.slice(0, 4)));
  const zone = vtimezone(c.timeZone, [Math.min(...years) - 1, ...years]);
  const at = text.indexOf('BEGIN:VEVENT');
  return text.slice(0, at) + zone + '\r\n' + text.slice(at);
}
