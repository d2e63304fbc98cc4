import { plainRecord, type PersonalDataPart } from '../platform/personal-data';

/**
 * Replies to launch days, check-ins at the field, flight cards and their altimeter logs. On deletion the replies go;
 * check-ins and flight cards stay as the club's range record of what flew, under the deleted account's marker, with
 * the free-text notes and the uploaded file's name erased.
 */
export const launchesPersonalData: PersonalDataPart = {
  /** The person's replies, check-ins and flight cards with their altimeter data, read one query after another in the export's transaction. */
  async export(trx, subject) {
    // One after another: queries on one transaction share its connection.
    const [rsvps, attendance, flights] = [
      await trx('launch_rsvps as r')
        .join('launches as l', 'l.id', 'r.launch_id')
        .where('r.user_id', subject.userId)
        .orderBy('l.launch_date')
        .select(
          'l.title as launch',
          trx.raw("to_char(l.launch_date, 'YYYY-MM-DD') AS launch_date"),
          'r.going',
          'r.updated_at',
        ),
      await trx('launch_attendance as a')
        .join('launches as l', 'l.id', 'a.launch_id')
        .where('a.user_id', subject.userId)
        .orderBy('l.launch_date')
        .select(
          'l.title as launch',
          trx.raw("to_char(l.launch_date, 'YYYY-MM-DD') AS launch_date"),
          'a.member_number',
          'a.checked_in_at',
        ),
      await trx('flights as f')
        .join('launches as l', 'l.id', 'f.launch_id')
        .leftJoin('flight_data as d', 'd.flight_id', 'f.id')
        .where('f.user_id', subject.userId)
        .orderBy('f.id')
        .select(
          'f.id',
          'l.title as launch',
          trx.raw("to_char(l.launch_date, 'YYYY-MM-DD') AS launch_date"),
          'f.rocket_name',
          'f.liftoff_mass_grams',
          'f.motors',
          'f.expected_altitude_metres',
          'f.recovery',
          'f.pad',
          'f.notes',
          'f.warnings',
          'f.certification_level',
          'f.status',
          'f.decision_reason',
          'f.outcome',
          'f.outcome_notes',
          'f.flown_at',
          'f.created_at',
          'd.file_name as log_file_name',
          'd.uploaded_at as log_uploaded_at',
          'd.summary as log_summary',
        ),
    ];
    return [
      {
        name: 'launch-replies',
        title: 'Launch replies',
        purpose: 'Whether you said you would come to a launch day, so organisers can plan.',
        records: rsvps.map(plainRecord),
      },
      {
        name: 'launch-check-ins',
        title: 'Check-ins',
        purpose: 'The launch days you were checked in at the field.',
        records: attendance.map(plainRecord),
      },
      {
        name: 'flights',
        title: 'Flight cards',
        purpose:
          'Flight cards you filed, the range decision and outcome, and the summary of any altimeter log you uploaded (the log rows themselves stay in Padside).',
        records: flights.map(plainRecord),
      },
    ];
  },

  /** Deletes the replies and blanks the notes and uploaded file names, keeping the check-ins and cards as the range record. */
  async erase(trx, subject) {
    await trx('launch_rsvps').where('user_id', subject.userId).delete();
    const flights = trx('flights').where('user_id', subject.userId).select('id');
    await trx('flight_data').whereIn('flight_id', flights).update({ file_name: null });
    await trx('flights')
      .where('user_id', subject.userId)
      .update({ notes: '', outcome_notes: null, updated_at: trx.fn.now() });
  },
};
