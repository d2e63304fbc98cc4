import type { Agreement, Sponsor } from '../../contracts/sponsors/sponsor-answers';
import type { SponsorCredit } from '../../contracts/sponsors/sponsor-credit';
import type { DeliverableInput } from './sponsor-ledger';
import type { DeliverableRow } from './agreement-repository';
import type { CreditRow } from './credit-repository';
import type { SponsorRow } from './sponsor-repository';

// The views are written once, in contracts/sponsors/; these names keep the server's own vocabulary.
/** An agreement with its money and ledger. */
export type AgreementView = Agreement;
/** One credit as staff and the portal read it. */
export type CreditView = SponsorCredit;
/** A sponsor as every answer names it. */
export type SponsorView = Sponsor;

export const toView = (s: SponsorRow): SponsorView => ({
  id: s.id,
  slug: s.slug,
  name: s.name,
  website: s.website,
  blurb: s.blurb,
  logoUrl: s.logo_url,
});

/** A credit as staff and the portal read it; `post` is the crediting post's address and title, when there is one. */
export const toCredit = (c: CreditRow, post?: { slug: string; title: string }): CreditView => ({
  id: c.id,
  kind: c.kind,
  url: c.url,
  at: c.credited_at.toISOString(),
  postSlug: post?.slug ?? null,
  postTitle: post?.title ?? null,
  videoTimestamp: c.video_timestamp,
  note: c.note,
  counted: c.deliverable_id !== null,
});

/** A deliverable row for the ledger; `listed` holds the sponsors standing on the public page in `season`. */
export const toInput = (d: DeliverableRow, listed: ReadonlySet<number>, season: string): DeliverableInput => ({
  id: d.id,
  kind: d.kind,
  quantity: d.quantity,
  dueOn: d.due_on,
  delivered: d.delivered,
  listedNow: d.season === season && listed.has(d.sponsor_id),
});
