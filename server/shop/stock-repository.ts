import type { Knex } from 'knex';

/** Units held and given back: variant caps, stock on hand and print runs, written only inside the caller's transaction. */
export class StockRepository {
  /**
   * Holds units for the lines with conditional updates, always in the same order (variant caps, stock, then runs,
   * each by id; `release` keeps it) so concurrent checkouts never deadlock. The run row comes last because every
   * buyer of a drop waits for that one row: it is then held only from its update to the commit. Returns false when
   * any line no longer fits; the caller rolls back.
   */
  async reserve(
    trx: Knex.Transaction,
    lines: { variantId: number; runId: number | null; quantity: number }[],
    now: Date,
  ): Promise<boolean> {
    const byVariant = [...lines].sort((a, b) => (a.runId ?? 0) - (b.runId ?? 0) || a.variantId - b.variantId);
    for (const l of byVariant.filter((x) => x.runId)) {
      // One statement: the cap's update, and whether the variant has a cap at all (most have none).
      const { rows } = await trx.raw(
        `WITH held AS (UPDATE shop_run_variant_caps SET reserved = reserved + ? WHERE run_id = ? AND variant_id = ? AND reserved + ? <= cap RETURNING 1)
         SELECT EXISTS (SELECT 1 FROM held) AS held, EXISTS (SELECT 1 FROM shop_run_variant_caps WHERE run_id = ? AND variant_id = ?) AS capped`,
        [l.quantity, l.runId, l.variantId, l.quantity, l.runId, l.variantId],
      );
      if (rows[0].capped && !rows[0].held) return false;
    }
    for (const l of byVariant.filter((x) => !x.runId)) {
      const n = await trx('shop_variants')
        .where('id', l.variantId)
        .whereNotNull('stock_on_hand')
        .where('stock_on_hand', '>=', l.quantity)
        .decrement('stock_on_hand', l.quantity);
      if (n !== 1) return false;
    }
    const perRun = new Map<number, number>();
    for (const l of lines) if (l.runId) perRun.set(l.runId, (perRun.get(l.runId) ?? 0) + l.quantity);
    for (const [runId, qty] of [...perRun].sort((a, b) => a[0] - b[0])) {
      const n = await trx('shop_runs')
        .where('id', runId)
        .whereIn('state', ['scheduled', 'open'])
        .where('opens_at', '<=', now)
        .where('closes_at', '>', now)
        .whereRaw('reserved + ? <= cap', [qty])
        .increment('reserved', qty);
      if (n !== 1) return false;
    }
    return true;
  }

  /** Gives units back to their variant cap and run, or to stock, in `reserve`'s order. */
  async release(
    trx: Knex.Transaction,
    lines: { variantId: number; runId: number | null; quantity: number }[],
  ): Promise<void> {
    const sorted = [...lines]
      .filter((l) => l.quantity > 0)
      .sort((a, b) => (a.runId ?? 0) - (b.runId ?? 0) || a.variantId - b.variantId);
    for (const l of sorted.filter((x) => x.runId))
      await trx('shop_run_variant_caps')
        .where({ run_id: l.runId, variant_id: l.variantId })
        .decrement('reserved', l.quantity);
    for (const l of sorted.filter((x) => !x.runId))
      await trx('shop_variants').where('id', l.variantId).increment('stock_on_hand', l.quantity);
    for (const l of sorted.filter((x) => x.runId))
      await trx('shop_runs').where('id', l.runId!).decrement('reserved', l.quantity);
  }
}
