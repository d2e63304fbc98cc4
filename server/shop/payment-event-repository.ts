import type { Knex } from 'knex';

/** The processor events already handled, by the processor's event id: each is handled once. */
export class PaymentEventRepository {
  constructor(private readonly db: Knex) {}

  /** Whether the event was already handled. */
  async seen(id: string): Promise<boolean> {
    return Boolean(await this.db('payment_events').where('id', id).first('id'));
  }

  /** Records the event as handled in the caller's transaction; false when another request recorded it first. */
  async record(trx: Knex.Transaction, event: { id: string; type: string }, at: Date): Promise<boolean> {
    const fresh = await trx('payment_events')
      .insert({ id: event.id, type: event.type, received_at: at })
      .onConflict('id')
      .ignore()
      .returning('id');
    return fresh.length > 0;
  }
}
