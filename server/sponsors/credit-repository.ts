import type { Knex } from 'knex';
import type { DeliverableKind } from './sponsor-ledger';

/** A credit as `sponsor_credits` holds it; `post_id` names the crediting build log, whose title the build logs lend. */
export interface CreditRow {
  id: number;
  sponsor_id: number;
  deliverable_id: number | null;
  kind: DeliverableKind;
  url: string | null;
  video_timestamp: string | null;
  note: string | null;
  post_id: number | null;
  credited_at: Date;
  withdrawn_at: Date | null;
}

/** Plain reads and writes of the credits given to sponsors (`sponsor_credits`). */
export class CreditRepository {
  constructor(private readonly db: Knex) {}

  /** Records one credit given to a sponsor, against a promise when it names one. */
  async insertCredit(
    trx: Knex.Transaction,
    c: {
      sponsorId: number;
      deliverableId: number | null;
      kind: DeliverableKind;
      url: string | null;
      videoTimestamp: string | null;
      note: string | null;
      postId: number | null;
      recordedBy: number | null;
      creditedAt: Date;
    },
  ): Promise<number> {
    const [row] = await trx('sponsor_credits')
      .insert({
        sponsor_id: c.sponsorId,
        deliverable_id: c.deliverableId,
        kind: c.kind,
        url: c.url,
        video_timestamp: c.videoTimestamp,
        note: c.note,
        post_id: c.postId,
        recorded_by: c.recordedBy,
        credited_at: c.creditedAt,
      })
      .returning('id');
    return row.id;
  }

  /** Sponsor ids with a live credit from the post. */
  async liveCreditSponsors(postId: number, trx: Knex = this.db): Promise<number[]> {
    const rows = await trx('sponsor_credits').where('post_id', postId).whereNull('withdrawn_at').select('sponsor_id');
    return rows.map((r: { sponsor_id: number }) => r.sponsor_id);
  }

  /** Withdraws a post's live credits for these sponsors (the post no longer thanks them), keeping the rows for the ledger's history. */
  async withdrawPostCredits(
    trx: Knex.Transaction,
    postId: number,
    sponsorIds: readonly number[],
    at: Date,
  ): Promise<number> {
    if (!sponsorIds.length) return 0;
    return trx('sponsor_credits')
      .where('post_id', postId)
      .whereIn('sponsor_id', sponsorIds)
      .whereNull('withdrawn_at')
      .update({ withdrawn_at: at });
  }

  /** Live credits of a sponsor, newest first; `post_id` names the crediting post, if any. */
  credits(sponsorId: number, trx: Knex = this.db): Promise<CreditRow[]> {
    return trx<CreditRow>('sponsor_credits')
      .where('sponsor_id', sponsorId)
      .whereNull('withdrawn_at')
      .orderBy([
        { column: 'credited_at', order: 'desc' },
        { column: 'id', order: 'desc' },
      ]);
  }
}
