import type { Knex } from 'knex';

export type MovementKind =
  'order_payment' | 'refund' | 'dues_payment' | 'manual_payment' | 'sponsor_cash' | 'processor_fee';
export type MovementSource = 'merch' | 'dues' | 'sponsor';

/** Tax inside a movement; negative amounts on refunds. */
export interface MovementTax {
  code: 'GST' | 'HST' | 'PST' | 'QST' | 'RST';
  jurisdiction: string;
  ratePercent: string;
  taxableCents: number;
  taxCents: number;
}

export interface Movement {
  occurredAt: Date;
  kind: MovementKind;
  source: MovementSource;
  /** Order number, member number, agreement id: what a person would look up. */
  reference: string;
  counterparty: string;
  /** Money in is positive, money out (refunds) negative. Includes tax. */
  grossCents: number;
  feeCents?: number;
  feeEstimated?: boolean;
  processorChargeId?: string | null;
  method: 'card' | 'cash' | 'e-transfer' | 'cheque' | 'other';
  /** Recording the same movement twice (a replayed webhook, a retried job) stores it once. */
  idempotencyKey?: string;
  taxes?: MovementTax[];
}

/** Records a movement in the caller's transaction; returns its id, or null if the idempotency key was seen. */
export async function recordMovement(trx: Knex.Transaction, m: Movement): Promise<number | null> {
  const rows = await trx('money_movements')
    .insert({
      occurred_at: m.occurredAt,
      kind: m.kind,
      source: m.source,
      reference: m.reference,
      counterparty: m.counterparty,
      gross_cents: m.grossCents,
      fee_cents: m.feeCents ?? 0,
      fee_estimated: m.feeEstimated ?? false,
      processor_charge_id: m.processorChargeId ?? null,
      method: m.method,
      idempotency_key: m.idempotencyKey ?? null,
    })
    .onConflict('idempotency_key')
    .ignore()
    .returning('id');
  if (!rows.length) return null;
  const id = rows[0].id;
  if (m.taxes?.length) {
    await trx('money_movement_taxes').insert(
      m.taxes.map((t) => ({
        movement_id: id,
        code: t.code,
        jurisdiction: t.jurisdiction,
        rate_percent: t.ratePercent,
        taxable_cents: t.taxableCents,
        tax_cents: t.taxCents,
      })),
    );
  }
  return id;
}
