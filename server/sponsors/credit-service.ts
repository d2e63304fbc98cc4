import type { Knex } from 'knex';
import { enqueueEmail } from '../mail/outbox';
import { creditPublishedEmail } from './sponsor-emails';
import { deliverableToCredit, type DeliverableKind } from './sponsor-ledger';
import type { AgreementRepository } from './agreement-repository';
import type { CreditRepository } from './credit-repository';
import type { SponsorRepository } from './sponsor-repository';

/** The post as the ledger needs it. */
export interface CreditingPost {
  id: number;
  slug: string;
  title: string;
  published: boolean;
}

/** Records credits against open deliverables: from published posts automatically, and off-site ones by hand. */
export class CreditService {
  constructor(
    private readonly repo: CreditRepository,
    private readonly sponsors: SponsorRepository,
    private readonly agreements: AgreementRepository,
    private readonly publicUrl: string,
    private readonly teamName: string,
  ) {}

  /**
   * Makes the post's live credits match what it should give: one per credited sponsor while published, none
   * otherwise. A new credit counts against the `build_log_credit` its marker named (`chosen`, deliverable id by
   * sponsor id) when that one is still open, else the sponsor's earliest open one; each contact is e-mailed once
   * per post and sponsor, however often the post is unpublished and published again.
   */
  async syncPostCredits(
    trx: Knex.Transaction,
    post: CreditingPost,
    sponsorIds: readonly number[],
    at: Date,
    chosen: ReadonlyMap<number, number> = new Map(),
  ): Promise<void> {
    const wanted = post.published ? new Set(sponsorIds) : new Set<number>();
    const live = await this.repo.liveCreditSponsors(post.id, trx);
    await this.repo.withdrawPostCredits(
      trx,
      post.id,
      live.filter((id) => !wanted.has(id)),
      at,
    );
    const link = `${this.publicUrl}/build-logs/${post.slug}`;
    for (const sponsorId of [...wanted].filter((id) => !live.includes(id)).sort((a, b) => a - b)) {
      await this.sponsors.lock(trx, sponsorId);
      const deliverableId = await this.openDeliverable(
        trx,
        sponsorId,
        'build_log_credit',
        chosen.get(sponsorId) ?? null,
      );
      await this.repo.insertCredit(trx, {
        sponsorId,
        deliverableId,
        kind: 'build_log_credit',
        url: link,
        videoTimestamp: null,
        note: null,
        postId: post.id,
        recordedBy: null,
        creditedAt: at,
      });
      const sponsor = (await this.sponsors.byId(sponsorId, trx))!;
      for (const c of await this.sponsors.contacts(sponsorId, trx)) {
        await enqueueEmail(trx, {
          ...creditPublishedEmail(
            c.email,
            c.display_name,
            sponsor.name,
            post.title,
            link,
            `${this.publicUrl}/sponsors/portal`,
            this.teamName,
          ),
          dedupeKey: `sponsor-credit:${post.id}:${sponsorId}:${c.user_id}`,
        });
      }
    }
  }

  /** An off-site credit (a video mention, a social post, a logo on a shirt run) recorded by staff. */
  async recordByHand(
    trx: Knex.Transaction,
    sponsorId: number,
    c: {
      kind: DeliverableKind;
      url: string | null;
      videoTimestamp: string | null;
      note: string | null;
      creditedAt: Date;
    },
    userId: number,
  ): Promise<{ id: number; deliverableId: number | null }> {
    await this.sponsors.lock(trx, sponsorId);
    const deliverableId = await this.openDeliverable(trx, sponsorId, c.kind);
    const id = await this.repo.insertCredit(trx, {
      sponsorId,
      deliverableId,
      kind: c.kind,
      url: c.url,
      videoTimestamp: c.videoTimestamp,
      note: c.note,
      postId: null,
      recordedBy: userId,
      creditedAt: c.creditedAt,
    });
    return { id, deliverableId };
  }

  /** The sponsor each of these deliverables was promised to, by deliverable id, so a post's marker can be checked against its sponsor. */
  deliverableSponsors(trx: Knex.Transaction, deliverableIds: readonly number[]): Promise<Map<number, number>> {
    return this.agreements.deliverableSponsors(deliverableIds, trx);
  }

  private async openDeliverable(
    trx: Knex.Transaction,
    sponsorId: number,
    kind: DeliverableKind,
    preferredId: number | null = null,
  ): Promise<number | null> {
    const rows = await this.agreements.deliverables(sponsorId, trx);
    const open = deliverableToCredit(
      rows.map((d) => ({
        id: d.id,
        kind: d.kind,
        quantity: d.quantity,
        dueOn: d.due_on,
        delivered: d.delivered,
      })),
      kind,
      preferredId,
    );
    return open?.id ?? null;
  }
}
