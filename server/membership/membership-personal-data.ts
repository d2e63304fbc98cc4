import type { Logger } from 'pino';
import type { SavedCards } from '../payments/saved-cards';
import { plainRecord, type PersonalDataPart } from '../platform/personal-data';

/** Audit entries whose detail holds only amounts, dates and states: they keep it; the others may quote what was typed. */
const AMOUNT_ONLY_AUDIT = ['term_paid', 'refunded', 'status_changed'];

const MEMBERSHIP_COLUMNS = [
  'id',
  'member_number',
  'status',
  'term_start',
  'term_end',
  'legal_name',
  'date_of_birth',
  'address',
  'phone',
  'emergency_contact',
  'association_number',
  'association_expires',
  'certification_level',
  'certification_date',
  'association_verified_at',
  'certification_verified_at',
  'waiver_version',
  'waiver_accepted_at',
  'safety_code_version',
  'safety_code_accepted_at',
  'auto_renew',
  'processor_customer_id',
  'created_at',
  'updated_at',
];

/**
 * The membership record, family members, dues payments and refunds, the record's history, and the saved card as the
 * processor describes it (brand and last four digits). On deletion the record keeps its member number, plan, terms
 * and every payment (the books need them) and loses the person: name, birth date, address, phone, emergency contact,
 * association number, family members; it lapses, auto-renew stops and the processor forgets the card. A card
 * payment or refund still under way holds the deletion.
 */
export function membershipPersonalData(savedCards: SavedCards, log: Pick<Logger, 'error'>): PersonalDataPart {
  return {
    async export(trx, subject) {
      const m = await trx('memberships').where('user_id', subject.userId).first(MEMBERSHIP_COLUMNS);
      if (!m) return [];
      // One after another: queries on one transaction share its connection.
      const [family, payments, audit] = [
        await trx('membership_family_members')
          .where('membership_id', m.id)
          .orderBy('id')
          .select('name', 'date_of_birth'),
        await trx('membership_payments as p')
          .join('membership_plans as pl', 'pl.id', 'p.plan_id')
          .where('p.membership_id', m.id)
          .orderBy('p.id')
          .select(
            'p.id',
            'pl.name as plan',
            'p.entry',
            'p.status',
            'p.method',
            'p.amount_cents',
            'p.receipt_number',
            'p.term_start',
            'p.term_end',
            'p.refund_of',
            'p.created_at',
          ),
        await trx('membership_audit')
          .where('membership_id', m.id)
          .orderBy('id')
          .select('action', 'detail', 'created_at'),
      ];
      const { processor_customer_id: customerId, ...record } = m;
      return [
        {
          name: 'membership',
          title: 'Membership',
          purpose:
            'Your club membership record: the details the club needs to run launches safely and reach you or your emergency contact.',
          records: [{ ...plainRecord(record), familyMembers: family.map(plainRecord) }],
        },
        {
          name: 'membership-payments',
          title: 'Dues payments and refunds',
          purpose: 'Each dues payment and refund. Kept for the books.',
          records: payments.map(plainRecord),
        },
        {
          name: 'membership-history',
          title: 'Membership history',
          purpose: 'Each change to your membership record and who made it, so a change can be explained later.',
          records: audit.map(plainRecord),
        },
        {
          name: 'saved-card',
          title: 'Saved card',
          purpose: 'The card the card processor keeps for your dues; Padside itself never holds the card number.',
          records: customerId ? [await describeCard(savedCards, customerId, log)] : [],
        },
      ];
    },

    async holds(trx, subject) {
      const busy = await trx('membership_payments as p')
        .join('memberships as m', 'm.id', 'p.membership_id')
        .where('m.user_id', subject.userId)
        .whereIn('p.status', ['attempted', 'requested'])
        .first('p.id');
      return busy ? ['A dues payment or refund is still being processed.'] : [];
    },

    async erase(trx, subject) {
      const m = await trx('memberships')
        .where('user_id', subject.userId)
        .forUpdate()
        .first('id', 'member_number', 'processor_customer_id');
      if (!m) return;
      await trx('money_movements')
        .where({ source: 'dues', reference: m.member_number })
        .update({ counterparty: subject.marker });
      await trx('membership_family_members').where('membership_id', m.id).delete();
      await trx('membership_audit')
        .where('membership_id', m.id)
        .whereNotIn('action', AMOUNT_ONLY_AUDIT)
        .update({ detail: '{}' });
      await trx('memberships').where('id', m.id).update({
        legal_name: subject.marker,
        date_of_birth: null,
        address: '',
        phone: '',
        emergency_contact: '',
        association_number: null,
        association_expires: null,
        association_verified_at: null,
        association_verified_by: null,
        association_verified_against: null,
        certification_date: null,
        certification_verified_at: null,
        certification_verified_by: null,
        certification_verified_against: null,
        status: 'lapsed',
        auto_renew: false,
        processor_customer_id: null,
        next_renewal_attempt_on: null,
        updated_at: trx.fn.now(),
      });
      await trx('membership_audit').insert({
        membership_id: m.id,
        actor_user_id: subject.userId,
        action: 'account_deleted',
        detail: '{}',
      });
      const customerId: string | null = m.processor_customer_id;
      if (!customerId) return;
      return async () => {
        // The account is gone either way; a processor that does not answer leaves a card nobody can charge from here.
        await savedCards
          .forget(customerId)
          .catch((err) => log.error({ err, customerId }, 'the card processor did not forget a deleted account’s card'));
      };
    },
  };
}

async function describeCard(
  savedCards: SavedCards,
  customerId: string,
  log: Pick<Logger, 'error'>,
): Promise<Record<string, unknown>> {
  try {
    return { ...((await savedCards.describe(customerId)) ?? { note: 'The card processor holds no card for you.' }) };
  } catch (err) {
    log.error({ err }, 'the card processor did not describe a saved card for an export');
    return {
      note: 'The card processor did not answer; the card is there, its brand and last digits could not be read just now.',
    };
  }
}
