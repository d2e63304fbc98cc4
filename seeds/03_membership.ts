import type { Knex } from 'knex';
import { hashPassword } from '../server/auth/password-hash';
import { recordMovement } from '../server/books/ledger-writer';
import { estimateFeeCents, PROCESSOR_FEES } from '../server/books/processor-fees';
import { termPolicy } from '../server/membership/dues-settlement';
import { MEMBERSHIP_SETTINGS } from '../server/membership/membership-settings';
import { addDays, duesFor, isInGoodStanding, statusOn, termForPayment } from '../server/membership/terms';
import { dateInZone } from '../server/platform/clock';
import { DEMO_PASSWORD } from './01_demo_accounts';

/**
 * Invented Gopher Flats Rocketry Society members, each with one paid term `paidDaysAgo` before the day of seeding.
 * Their terms follow the club's own rules (calendar year, late-season date, grace), so the statuses depend on the
 * day: the demo member is always active, one member always lapsed and one pending; lapsing shows in January.
 */
const ROSTER = [
  {
    email: 'member@padside.test',
    name: 'Tomasz Redfeather',
    plan: 'adult',
    paidDaysAgo: 20,
    cert: 'L1',
    assoc: 'GFRS-NA-20418',
    assocInDays: 260,
    method: 'card',
    checked: ['association', 'certification'],
  },
  {
    email: 'hollis.quarrie@padside.test',
    name: 'Hollis Quarrie',
    plan: 'adult',
    paidDaysAgo: 120,
    cert: 'L2',
    assoc: 'GFRS-NA-31187',
    assocInDays: 20,
    method: 'cash',
    checked: ['association'],
  },
  {
    email: 'ines.bakkegard@padside.test',
    name: 'Ines Bakkegard',
    plan: 'family',
    paidDaysAgo: 45,
    cert: 'none',
    assoc: 'GFRS-NA-40021',
    assocInDays: 300,
    method: 'e-transfer',
    checked: [],
  },
  {
    email: 'wim.oyelaran@padside.test',
    name: 'Wim Oyelaran',
    plan: 'junior',
    paidDaysAgo: 90,
    cert: 'none',
    assoc: null,
    assocInDays: null,
    method: 'cheque',
    checked: [],
  },
  {
    email: 'saoirse.tenpenny@padside.test',
    name: 'Saoirse Tenpenny',
    plan: 'adult',
    paidDaysAgo: 400,
    cert: 'L3',
    assoc: 'GFRS-NA-11876',
    assocInDays: 40,
    method: 'card',
    checked: [],
  },
  {
    email: 'ruben.halloway@padside.test',
    name: 'Ruben Halloway',
    plan: 'adult',
    paidDaysAgo: 700,
    cert: 'L1',
    assoc: 'GFRS-NA-27733',
    assocInDays: -30,
    method: 'cash',
    checked: [],
  },
  {
    email: 'dagny.mcallister@padside.test',
    name: 'Dagny McAllister',
    plan: 'adult',
    paidDaysAgo: null,
    cert: 'none',
    assoc: null,
    assocInDays: null,
    method: null,
    checked: [],
  },
] as const;

export async function seed(knex: Knex): Promise<void> {
  const hash = await hashPassword(DEMO_PASSWORD);
  const today = dateInZone(new Date(), process.env.CLUB_TIME_ZONE ?? 'America/Winnipeg');
  const policy = termPolicy(MEMBERSHIP_SETTINGS.defaults);
  const plans = Object.fromEntries(
    (await knex('membership_plans').select('id', 'code', 'dues_cents')).map((p) => [p.code, p]),
  );
  // The demo treasurer has seen some members' association cards and certificates; the rest are members' own claims.
  const checker = await knex('users').where('email', 'treasurer@padside.test').first('id');
  const checkedOn = new Date(`${addDays(today, -10)}T18:00:00Z`);
  let receipt = 400;
  for (const r of ROSTER) {
    await knex('users')
      .insert({
        email: r.email,
        password_hash: hash,
        display_name: r.name,
        roles: ['fan'],
        email_verified_at: knex.fn.now(),
      })
      .onConflict('email')
      .ignore();
    const user = await knex('users').where('email', r.email).first('id');
    if (await knex('memberships').where('user_id', user.id).first()) continue;
    const paidOn = r.paidDaysAgo === null ? null : addDays(today, -r.paidDaysAgo);
    const term = paidOn ? termForPayment(paidOn, null, policy) : null;
    const status = statusOn(today, term?.end ?? null, policy);
    // Midday in the club's zone, give or take an hour: the receipt and the books put it on that date.
    const paidAt = paidOn ? new Date(`${paidOn}T18:00:00Z`) : null;
    await knex.transaction(async (trx) => {
      const [m] = await trx('memberships')
        .insert({
          user_id: user.id,
          member_number: trx.raw("lpad(nextval('membership_number_seq')::text, 5, '0')"),
          plan_id: plans[r.plan].id,
          status,
          term_start: term?.start ?? null,
          term_end: term?.end ?? null,
          legal_name: r.name,
          date_of_birth: r.plan === 'junior' ? addDays(today, -15 * 365) : '1984-05-17',
          address: '27 Coulee Crescent, Gopher Flats, MB',
          phone: '204-555-0100',
          emergency_contact: 'Gopher Flats neighbour, 204-555-0199',
          association_number: r.assoc,
          association_expires: r.assocInDays === null ? null : addDays(today, r.assocInDays),
          certification_level: r.cert,
          certification_date: r.cert === 'none' ? null : '2024-07-13',
          ...((r.checked as readonly string[]).includes('association')
            ? {
                association_verified_at: checkedOn,
                association_verified_by: checker?.id ?? null,
                association_verified_against: 'association card, seen at the spring launch',
              }
            : {}),
          ...((r.checked as readonly string[]).includes('certification')
            ? {
                certification_verified_at: checkedOn,
                certification_verified_by: checker?.id ?? null,
                certification_verified_against: 'certification card, seen at the spring launch',
              }
            : {}),
          waiver_version: '2026-1',
          waiver_accepted_at: trx.fn.now(),
          safety_code_version: '2026-1',
          safety_code_accepted_at: trx.fn.now(),
        })
        .returning('*');
      if (r.plan === 'family')
        await trx('membership_family_members').insert([
          { membership_id: m.id, name: 'Pell Bakkegard', date_of_birth: '2015-03-02' },
        ]);
      await trx('users')
        .where('id', user.id)
        .update({
          roles: trx.raw(
            isInGoodStanding(status)
              ? "array_append(array_remove(roles, 'member'), 'member')"
              : "array_remove(roles, 'member')",
          ),
        });
      if (!term || !paidAt || !r.method) return;
      const key = `seed:${m.member_number}`;
      const amount = duesFor(plans[r.plan].dues_cents, term, policy);
      await trx('membership_payments').insert({
        membership_id: m.id,
        plan_id: plans[r.plan].id,
        status: 'paid',
        method: r.method,
        amount_cents: amount,
        receipt_number: r.method === 'card' ? null : `GF-${receipt++}`,
        idempotency_key: key,
        term_start: term.start,
        term_end: term.end,
        created_at: paidAt,
      });
      await recordMovement(trx, {
        occurredAt: paidAt,
        kind: r.method === 'card' ? 'dues_payment' : 'manual_payment',
        source: 'dues',
        reference: m.member_number,
        counterparty: r.name,
        grossCents: amount,
        ...(r.method === 'card'
          ? { feeCents: estimateFeeCents(amount, false, PROCESSOR_FEES.defaults), feeEstimated: true }
          : {}),
        method: r.method,
        idempotencyKey: `dues:${key}`,
      });
      await trx('membership_audit').insert({
        membership_id: m.id,
        action: 'term_paid',
        detail: JSON.stringify({ seeded: true, to: term.end }),
      });
    });
  }
}
