import type { SponsorCredit } from '../../contracts/sponsors/sponsor-credit';
import type { DeliverableInput, DeliverableLine, KindSummary } from './sponsor-ledger';
import type { CreditRow, DeliverableRow, SponsorRow } from './sponsor-repository';
import type { TaxTreatment } from './sponsor-tax';

export interface AgreementView {
  id: number;
  season: string;
  cashCents: number;
  cashReceivedOn: string | null;
  /** The promised cash once staff recorded it as received, else 0: what the portal and the report both show. */
  cashReceivedCents: number;
  taxTreatment: TaxTreatment;
  taxProvince: string | null;
  inKind: { id: number; description: string; valueCents: number; receivedOn: string | null }[];
  inKindCents: number;
  totalCents: number;
  note: string | null;
  deliverables: DeliverableLine[];
  byKind: KindSummary[];
  overdue: DeliverableLine[];
  nextDue: DeliverableLine | null;
}

/** One credit as staff and the portal read it; written once, in contracts/. */
export type CreditView = SponsorCredit;

export interface SponsorView {
  id: number;
  slug: string;
  name: string;
  website: string | null;
  blurb: string | null;
  logoUrl: string | null;
}

export const toView = (s: SponsorRow): SponsorView => ({ id: Number(s.id), slug: s.slug, name: s.name, website: s.website, blurb: s.blurb, logoUrl: s.logo_url });

export const toCredit = (c: CreditRow): CreditView => ({
  id: Number(c.id),
  kind: c.kind,
  url: c.url,
  at: c.credited_at.toISOString(),
  postSlug: c.post_slug,
  postTitle: c.post_title,
  videoTimestamp: c.video_timestamp,
  note: c.note,
  counted: c.deliverable_id !== null,
});

/** A deliverable row for the ledger; `listed` holds the sponsors standing on the public page in `season`. */
export const toInput = (d: DeliverableRow, listed: ReadonlySet<number>, season: string): DeliverableInput => ({
  id: Number(d.id),
  kind: d.kind,
  quantity: d.quantity,
  dueOn: d.due_on,
  delivered: Number(d.delivered),
  listedNow: d.season === season && listed.has(Number(d.sponsor_id)),
});
