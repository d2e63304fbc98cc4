import type { Knex } from 'knex';
import { deletedEmail, plainRecord, type DataSubject, type PersonalDataPart } from '../platform/personal-data';

/** Rate-limit keys that carry an account's e-mail (`prefix:email` or `prefix:email|ip`). */
const EMAIL_KEYED_LIMITS = ['register-address', 'verify-resend-address', 'reset-account', 'signin-pair'];

const likeEscape = (s: string) => s.replace(/[\\%_]/g, (c) => '\\' + c);

/**
 * The account itself: profile and roles, sign-ins (familiar addresses, the failure count, open sessions), one-time
 * links, and the mail Padside queued or sent to the address. Erasing it turns the row into a tombstone that staff
 * still see ("Deleted account #12"), ends every session and frees the e-mail. It runs after every feature's part.
 */
export const accountPersonalData: PersonalDataPart = {
  async export(trx, subject) {
    const user = await trx('users')
      .where('id', subject.userId)
      .first(
        'id',
        'email',
        'display_name',
        'roles',
        'email_verified_at',
        'marketing_opt_out',
        'created_at',
        'updated_at',
      );
    const addresses = await trx('sign_in_addresses')
      .where('user_id', subject.userId)
      .orderBy('last_success_at', 'desc')
      .select('ip', 'last_success_at');
    const lockout = await trx('sign_in_lockouts')
      .where('account_key', subject.email)
      .first('failures_elsewhere', 'failures_familiar', 'last_elsewhere_at', 'last_familiar_at');
    const sessions = await trx('session')
      .whereRaw(`(sess->'passport'->>'user') = ?`, [String(subject.userId)])
      .orderBy('expire', 'desc')
      .select('expire');
    const tokens = await trx('auth_tokens')
      .where('user_id', subject.userId)
      .orderBy('created_at', 'desc')
      .select('purpose', 'created_at', 'expires_at', 'used_at');
    const mail = await trx('outbound_emails')
      .where('to_address', subject.email)
      .orderBy('created_at', 'desc')
      .select('subject', 'template', 'status', 'created_at', 'sent_at');
    return [
      {
        name: 'profile',
        title: 'Profile',
        purpose: 'Your account: how you sign in, the name shown on Padside, your roles and your mail preference.',
        records: [plainRecord(user)],
      },
      {
        name: 'sign-ins',
        title: 'Sign-ins',
        purpose:
          'Addresses you signed in from (so failures elsewhere never lock you out of them), failed attempts, and sessions still open.',
        records: [
          ...addresses.map((a) => ({ kind: 'familiar_address', ...plainRecord(a) })),
          ...(lockout ? [{ kind: 'failed_attempts', ...plainRecord(lockout) }] : []),
          // Session expiry times only: a session's id would let anyone holding this file act as you.
          ...sessions.map((s) => ({ kind: 'open_session', expiresAt: new Date(s.expire).toISOString() })),
        ],
      },
      {
        name: 'account-links',
        title: 'E-mail confirmation and password links',
        purpose:
          'When links to confirm your e-mail or reset your password were made and used (the links themselves are not kept).',
        records: tokens.map(plainRecord),
      },
      {
        name: 'mail',
        title: 'Mail sent to you',
        purpose: 'The subject and state of each e-mail Padside queued or sent to your address.',
        records: mail.map(plainRecord),
      },
    ];
  },

  async erase(trx, subject) {
    await trx('auth_tokens').where('user_id', subject.userId).delete();
    await trx('sign_in_addresses').where('user_id', subject.userId).delete();
    await trx('sign_in_lockouts').where('account_key', subject.email).delete();
    for (const prefix of EMAIL_KEYED_LIMITS) {
      await trx('rate_limits')
        .whereRaw("key = ? OR key LIKE ? ESCAPE '\\'", [
          `${prefix}:${subject.email}`,
          `${prefix}:${likeEscape(subject.email)}|%`,
        ])
        .delete();
    }
    await trx('outbound_emails').where('to_address', subject.email).delete();
    await trx('uploads').where('uploaded_by', subject.userId).update({ uploaded_by: null });
    await endAllSessions(trx, subject);
    await trx('users')
      .where('id', subject.userId)
      .update({
        email: deletedEmail(subject.userId),
        display_name: subject.marker,
        // Not an argon2 hash, so no password ever matches it.
        password_hash: 'erased',
        roles: trx.raw("'{}'::text[]"),
        email_verified_at: null,
        marketing_opt_out: true,
        deleted_at: trx.fn.now(),
        updated_at: trx.fn.now(),
      });
  },
};

/** Every session of the account, the one that asked included (connect-pg-simple stores passport.user in `sess`). */
function endAllSessions(trx: Knex.Transaction, subject: DataSubject): Promise<number> {
  return trx('session')
    .whereRaw(`(sess->'passport'->>'user') = ?`, [String(subject.userId)])
    .delete();
}
