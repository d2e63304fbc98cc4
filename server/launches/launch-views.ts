import { LAUNCH_STATUS_LABELS } from '../../contracts/labels/launch-statuses';
import type { LaunchView } from '../../contracts/launches/launch-answers';
import type { LaunchRow } from './launch-repository';

const num = (v: string | null) => (v === null ? null : Number(v));

/** A launch as every answer shows it. */
export function launchView(l: LaunchRow): LaunchView {
  return {
    id: l.id,
    title: l.title,
    date: l.launch_date,
    startsAt: l.starts_at,
    endsAt: l.ends_at,
    status: l.status,
    statusLabel: LAUNCH_STATUS_LABELS[l.status],
    callOffReason: l.call_off_reason,
    site: { name: l.site_name, address: l.site_address, lat: num(l.site_lat), lon: num(l.site_lon) },
    ceilingMetres: l.ceiling_metres,
    waiverVersion: l.waiver_version,
    notes: l.notes,
    rsvpCount: l.rsvp_count ?? 0,
  };
}
