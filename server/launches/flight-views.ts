import { FLIGHT_OUTCOME_LABELS, FLIGHT_STATUS_LABELS } from '../../contracts/labels/launch-statuses';
import type { FlightDataView, FlightView } from '../../contracts/launches/launch-answers';
import type { FlightDataRow, FlightRow } from './flight-repository';

/** The caution every flight page and the range queue carry, in Padside's words. */
export const FLIGHT_CAUTION =
  'Padside only keeps the record. The range safety officer decides what flies and when. Fly under your national ' +
  "association's safety code and the local aviation and fire rules.";

/** A flight card as its flyer, the range officer and the public flight page see it. */
export function flightView(f: FlightRow): FlightView {
  return {
    id: f.id,
    launchId: f.launch_id,
    launchTitle: f.launch_title,
    launchDate: f.launch_date,
    flyer: { userId: f.user_id, name: f.flyer_name, certificationLevel: f.certification_level },
    rocketName: f.rocket_name,
    postSlug: f.post_slug,
    liftoffMassGrams: f.liftoff_mass_grams,
    motors: f.motors.map((m) => ({
      designation: m.designation,
      impulseClass: m.impulseClass,
      averageThrustN: m.averageThrustN,
      delayS: m.delayS,
      plugged: m.plugged,
      totalImpulseMinNs: m.totalImpulseMinNs,
      totalImpulseMaxNs: m.totalImpulseMaxNs,
    })),
    expectedAltitudeMetres: f.expected_altitude_metres,
    recovery: f.recovery,
    pad: f.pad,
    notes: f.notes,
    thrustToWeight: Number(f.thrust_to_weight),
    warnings: f.warnings,
    needsHighPower: f.needs_high_power,
    status: f.status,
    statusLabel: FLIGHT_STATUS_LABELS[f.status],
    decisionReason: f.decision_reason,
    outcome: f.outcome,
    outcomeLabel: f.outcome ? FLIGHT_OUTCOME_LABELS[f.outcome] : null,
    outcomeNotes: f.outcome_notes,
    apogeeMetres: f.apogee_metres ?? null,
    filedAt: f.created_at.toISOString(),
  };
}

/** A flight's stored analysis: its summary, the downsampled series for the chart, events, mapping and filter. */
export function flightDataView(d: FlightDataRow | undefined): FlightDataView | null {
  if (!d) return null;
  return {
    summary: d.summary,
    series: d.series,
    events: d.events,
    mapping: d.mapping,
    filter: d.filter,
    fileName: d.file_name,
    uploadedAt: d.uploaded_at.toISOString(),
  };
}
