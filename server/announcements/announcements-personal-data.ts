import { plainRecord, type PersonalDataPart } from '../platform/personal-data';
import { withdrawAllConsents } from './consent-withdrawal';

/**
 * The lists a person asked to hear from (with the wording they agreed to), the consents Padside implied from a
 * purchase or a membership, and the suppressions on their address. An address's records count as the person's only
 * once they confirmed the address, as with guest orders. On deletion every consent is withdrawn and the address is
 * suppressed on every list: the withdrawn record stays as the proof of consent the anti-spam law asks a sender to
 * keep (from memory), no longer tied to the account.
 */
export const announcementsPersonalData: PersonalDataPart = {
  /** The person's list consents (by account, and by address once verified), implied consents and suppressions. */
  async export(trx, subject) {
    const byAddress = subject.emailVerified ? subject.email : null;
    const [subscriptions, implied, suppressions] = [
      await trx('subscriptions as s')
        .leftJoin('shop_products as p', 'p.id', 's.product_id')
        .where((q) => {
          q.where('s.user_id', subject.userId);
          if (byAddress) q.orWhere('s.email', byAddress);
        })
        .orderBy('s.id')
        .select(
          's.email',
          's.topic',
          'p.name as product',
          's.wording_version',
          's.wording_text',
          's.source_page',
          's.source_ip',
          's.requested_at',
          's.confirmed_at',
          's.confirmed_how',
          's.withdrawn_at',
          's.withdrawn_how',
        ),
      byAddress
        ? await trx('implied_consents')
            .where('email', byAddress)
            .orderBy('id')
            .select('basis', 'basis_on', 'recorded_at')
        : [],
      byAddress
        ? await trx('email_suppressions').where('email', byAddress).orderBy('id').select('list', 'reason', 'created_at')
        : [],
    ];
    return [
      {
        name: 'consents',
        title: 'Lists you asked to hear from',
        purpose:
          'The proof of your consent to announcements: what you were shown, when, from where, and when you withdrew it.',
        records: subscriptions.map(plainRecord),
      },
      {
        name: 'implied-consents',
        title: 'Consents from a purchase or membership',
        purpose:
          'A purchase or a membership lets Padside write to you for a limited time; these are the dates it counts from.',
        records: implied.map(plainRecord),
      },
      {
        name: 'mail-suppressions',
        title: 'Mail we must not send you',
        purpose: 'Addresses that unsubscribed, bounced or complained, checked before every send.',
        records: suppressions.map(plainRecord),
      },
    ];
  },

  /** Withdraws every consent of the address and unlinks its subscriptions from the account, keeping the records as proof of what was agreed. */
  async erase(trx, subject) {
    await withdrawAllConsents(trx, subject.email, new Date(), 'account deleted');
    await trx('subscriptions').where('user_id', subject.userId).update({ user_id: null });
  },
};
