import type { Knex } from 'knex';
import { AppError } from '../platform/app-error';
import type { SessionUser } from '../platform/roles';
import type { SaveCardResult } from '../payments/saved-cards';
import type { CardDues } from './card-dues';
import type { MembershipRepository, MembershipRow } from './membership-repository';

/** The answer to a card the processor declined, shown on the card field. */
export const declined = (message: string) => new AppError(402, 'payment_declined', message, { paymentToken: message });

/** The member's card kept with the processor for auto-renew and one-click renewals. */
export class CardOnFile {
  constructor(
    private readonly db: Knex,
    private readonly repo: MembershipRepository,
    private readonly cardDues: CardDues,
  ) {}

  /** Puts the card on file with the processor and keeps the customer id and the card's brand and last four. */
  async save(m: MembershipRow, user: SessionUser, token: string): Promise<SaveCardResult> {
    const saved = m.processor_customer_id
      ? await this.cardDues.savedCards.replace(m.processor_customer_id, token)
      : await this.cardDues.savedCards.save(token, user.email, m.legal_name, `customer:${m.id}:${token}`);
    if (saved.outcome === 'saved') {
      await this.db.transaction((trx) =>
        this.repo.update(trx, m.id, {
          processor_customer_id: saved.customerId,
          card_brand: saved.card?.brand ?? null,
          card_last4: saved.card?.last4 ?? null,
        }),
      );
    }
    return saved;
  }
}
