import type { Knex } from 'knex';
import { SuppressionList } from '../mail/suppression-list';
import { SubscriptionRepository } from './subscription-repository';

/**
 * Withdraws every consent an address gave or implied, in the caller's transaction (account deletion uses it): live
 * express consents are marked withdrawn with `how`, implied consents are removed, and the address goes on the
 * suppression list for every list, so no later commercial mail reaches it, whatever a purchase history says.
 */
export async function withdrawAllConsents(trx: Knex.Transaction, email: string, at: Date, how: string): Promise<void> {
  const address = email.trim().toLowerCase();
  await new SubscriptionRepository(trx).withdraw(trx, address, null, at, how);
  await trx('implied_consents').where('email', address).delete();
  await new SuppressionList(trx).add(trx, address, 'unsubscribed', { detail: how });
}
