import type { FlightDataRow, FlightRow } from './flight-repository';

/** The caution every flight page and the range queue carry, in Padside's words. */
export const FLIGHT_CAUTION =
  'Padside only keeps the record. The range safety officer decides what flies and when. Fly under your national ' +
  "association's safety code and the local aviation and fire rules.";

/** Padside's words for how a flight ended. */
export const OUTCOME_LABELS: Record<string, string> = {
  recovered: 'Recovered',
  damaged: 'Recovered with damage',
  lost: 'Lost',
  tree: 'Caught in a tree',
  motor_failure: 'Motor failure',
};

/** Padside's words for a card's state. */
export const FLIGHT_STATUS_LABELS: Record<FlightRow['status'], string> = { filed: 'Waiting at the table', approved: 'Cleared to fly', sent_back: 'Sent back', flown: 'Flown' };

/** Padside's words for recovery methods. */
export const RECOVERY_LABELS: Record<string, string> = { parachute: 'Parachute', streamer: 'Streamer', dual_deploy: 'Dual deployment' };

/** A flight card as its flyer, the range officer and the public flight page see it. */
export function flightView(f: FlightRow) {
  return {
    id: Number(f.id),
    launchId: Number(f.launch_id),
    launchTitle: f.launch_title,
    launchDate: f.launch_date,
    flyer: { userId: Number(f.user_id), name: f.flyer_name, certificationLevel: f.certification_level },
    rocketName: f.rocket_name,
    postSlug: f.post_slug,
    liftoffMassGrams: f.liftoff_mass_grams,
    motors: f.motors.map((m) => ({ designation: m.designation, impulseClass: m.impulseClass, averageThrustN: m.averageThrustN, delayS: m.delayS, plugged: m.plugged, totalImpulseMinNs: m.totalImpulseMinNs, totalImpulseMaxNs: m.totalImpulseMaxNs })),
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
    outcomeLabel: f.outcome ? OUTCOME_LABELS[f.outcome] : null,
    outcomeNotes: f.outcome_notes,
    apogeeMetres: f.apogee_metres ?? null,
    filedAt: f.created_at,
  };
}

/** A flight's stored analysis: its summary, the downsampled series for the chart, events, mapping and filter. */
export function flightDataView(d: FlightDataRow | undefined) {
  if (!d) return null;
  return { summary: d.summary, series: d.series, events: d.events, mapping: d.mapping, filter: d.filter, fileName: d.file_name, uploadedAt: d.uploaded_at };
}
