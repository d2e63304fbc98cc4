import type { Knex } from 'knex';
import type { PaymentRow } from './membership-repository';

/** Reads and writes of the dues ledger: payments, refunds and what they add up to. */
export class DuesPaymentRepository {
  constructor(private readonly db: Knex) {}

  /** Records a dues payment or refund row in the caller's transaction or connection. */
  async insertPayment(
    trx: Knex.Transaction,
    row: Partial<PaymentRow> &
      Pick<PaymentRow, 'membership_id' | 'plan_id' | 'status' | 'method' | 'amount_cents' | 'idempotency_key'>,
  ): Promise<PaymentRow> {
    const [created] = await trx<PaymentRow>('membership_payments').insert(row).returning('*');
    return created;
  }

  /** Writes the given columns of one payment or refund row, such as its settled status. */
  async updatePayment(trx: Knex.Transaction, id: number, patch: Partial<PaymentRow>): Promise<PaymentRow> {
    const [row] = await trx<PaymentRow>('membership_payments').where('id', id).update(patch).returning('*');
    return row;
  }

  /** One payment or refund row by id, unlocked; use `lockPayment` when settling it. */
  payment(id: number, db: Knex = this.db): Promise<PaymentRow | undefined> {
    return db<PaymentRow>('membership_payments').where('id', id).first();
  }

  /** The payment or refund row, locked until `trx` ends so its settlement is decided once. */
  lockPayment(trx: Knex.Transaction, id: number): Promise<PaymentRow | undefined> {
    return trx<PaymentRow>('membership_payments').where('id', id).forUpdate().first();
  }

  /** The payment recorded under this idempotency key, so a repeated attempt finds the first one instead of paying twice. */
  paymentByKey(key: string, db: Knex = this.db): Promise<PaymentRow | undefined> {
    return db<PaymentRow>('membership_payments').where('idempotency_key', key).first();
  }

  /** The card payments (not refunds) of one membership for the term ending `termEnd`, oldest first. */
  cardPaymentsForTerm(membershipId: number, termEnd: string, db: Knex = this.db): Promise<PaymentRow[]> {
    return db<PaymentRow>('membership_payments')
      .where({ membership_id: membershipId, term_end: termEnd, entry: 'payment', method: 'card' })
      .orderBy('id');
  }

  /** Every payment and refund of one membership, newest first, for the treasurer's record. */
  payments(membershipId: number, db: Knex = this.db): Promise<PaymentRow[]> {
    return db<PaymentRow>('membership_payments')
      .where('membership_id', membershipId)
      .orderBy([
        { column: 'created_at', order: 'desc' },
        { column: 'id', order: 'desc' },
      ]);
  }

  /** Money refunded against a payment (a positive number): settled refunds, plus claims still `requested`. */
  async refundedCents(
    paymentId: number,
    db: Knex = this.db,
    statuses: PaymentRow['status'][] = ['refunded', 'requested'],
  ): Promise<number> {
    const [{ sum }] = await db('membership_payments')
      .where({ refund_of: paymentId, entry: 'refund' })
      .whereIn('status', statuses)
      .sum<{ sum: number | null }[]>({ sum: 'amount_cents' });
    return -(sum ?? 0);
  }

  /** The refund a client key (Idempotency-Key) already asked for on this membership. */
  refundByRequestKey(membershipId: number, key: string, db: Knex = this.db): Promise<PaymentRow | undefined> {
    return db<PaymentRow>('membership_payments')
      .where({ membership_id: membershipId, request_key: key, entry: 'refund' })
      .first();
  }

  /** Refunds recorded against one payment, oldest first. */
  refundsOf(paymentId: number, db: Knex = this.db): Promise<PaymentRow[]> {
    return db<PaymentRow>('membership_payments').where({ refund_of: paymentId, entry: 'refund' }).orderBy('id');
  }

  /** The paid card payment behind a processor charge. */
  paymentByCharge(chargeId: string, db: Knex = this.db): Promise<PaymentRow | undefined> {
    return db<PaymentRow>('membership_payments')
      .where({ processor_charge_id: chargeId, entry: 'payment' })
      .whereIn('status', ['paid', 'refunded'])
      .first();
  }

  /** Card refund claims still waiting for the processor's answer since before `before`. */
  staleRefundClaims(before: Date, db: Knex = this.db): Promise<PaymentRow[]> {
    return db<PaymentRow>('membership_payments')
      .where({ entry: 'refund', status: 'requested' })
      .where('created_at', '<', before)
      .orderBy('id')
      .limit(100);
  }

  /** Net dues per calendar month (club time zone) and plan, over paid payments and refunds. */
  collectedByMonth(
    timeZone: string,
    db: Knex = this.db,
  ): Promise<{ month: string; plan_code: string; plan_name: string; cents: number; payments: number }[]> {
    return db('membership_payments as pay')
      .join('membership_plans as p', 'p.id', 'pay.plan_id')
      .whereIn('pay.status', ['paid', 'refunded'])
      .select(
        db.raw("to_char(pay.created_at AT TIME ZONE ?, 'YYYY-MM') as month", [timeZone]),
        'p.code as plan_code',
        'p.name as plan_name',
      )
      .sum({ cents: 'pay.amount_cents' })
      .select(db.raw("count(*) FILTER (WHERE pay.entry = 'payment') as payments"))
      .groupByRaw('1, p.code, p.name')
      .orderByRaw('1 DESC, p.code');
  }
}
