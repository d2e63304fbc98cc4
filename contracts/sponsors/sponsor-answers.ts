/** What the sponsor routes answer (public wall, portal, staff): the server types its views with these; the app reads them. */
import type { DeliverableKind } from '../labels/deliverable-kinds';
import type { Province } from '../shop/provinces';
import type { SponsorCredit } from './sponsor-credit';
import type { TaxTreatment } from './tax-treatments';

/** One promise of an agreement, with what was delivered against it. */
export interface DeliverableLine {
  id: number;
  kind: DeliverableKind;
  promised: number;
  delivered: number;
  dueOn: string;
  overdue: boolean;
  /** A sponsors-page listing delivered by the sponsor standing on the public page now, not by a recorded credit. */
  listedNow: boolean;
}

/** Promised vs delivered for one kind of deliverable. */
export interface KindSummary {
  kind: DeliverableKind;
  promised: number;
  delivered: number;
}

/** A sponsorship agreement with its money and its ledger. */
export interface Agreement {
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

/** The fields of an agreement only the treasurer and admin are sent. */
type MoneyField =
  | 'cashCents'
  | 'cashReceivedOn'
  | 'cashReceivedCents'
  | 'taxTreatment'
  | 'taxProvince'
  | 'inKind'
  | 'inKindCents'
  | 'totalCents'
  | 'note';
/** GET /api/admin/sponsors/:id/ledger: an agreement as staff get it, the money fields only for the treasurer and admin. */
export type StaffAgreement = Omit<Agreement, MoneyField> & Partial<Pick<Agreement, MoneyField>>;

/** A sponsor as every answer names it. */
export interface Sponsor {
  id: number;
  slug: string;
  name: string;
  website: string | null;
  blurb: string | null;
  logoUrl: string | null;
}

/** GET /api/sponsors/wall: one sponsor on the public page. */
export interface SponsorCard extends Sponsor {
  /** The stored logo's size in pixels; null when there is no uploaded logo. */
  logoSize: { width: number; height: number } | null;
  posts: { slug: string; title: string }[];
}

/** GET /api/sponsors/wall: the season's sponsors by tier. */
export interface SponsorWall {
  season: string;
  tiers: { name: string; sponsors: SponsorCard[] }[];
}

/** A credit as the sponsor's own portal shows it. */
export interface PortalCredit {
  kind: DeliverableKind;
  url: string | null;
  at: string;
  postSlug?: string;
  postTitle?: string;
  note: string | null;
  videoTimestamp: string | null;
}

/** GET /api/sponsor-portal/me. */
export interface PortalView {
  sponsor: Sponsor;
  agreements: Agreement[];
  credits: PortalCredit[];
}

/** GET /api/admin/sponsors: one row of the staff list. */
export interface AdminSponsorRow extends Sponsor {
  tier: string | null;
  /** Only for the treasurer and admin; editors are not sent sponsor money. */
  seasonTotalCents?: number;
}

/** GET /api/admin/sponsors/:id. */
export interface SponsorDetail {
  sponsor: Sponsor;
  /** `email` only for the treasurer and admin. */
  contacts: { userId: number; email?: string; displayName: string }[];
  credits: SponsorCredit[];
}

/** GET /api/admin/sponsors/overdue: a promise past its day and still short. */
export interface OverdueItem {
  sponsorId: number;
  sponsorName: string;
  agreementId: number;
  kind: DeliverableKind;
  promised: number;
  delivered: number;
  dueOn: string;
}

/** PUT /api/admin/sponsors/agreements/:agreementId/tax-treatment: the treatment as stored. */
export interface TaxTreatmentAnswer {
  taxTreatment: TaxTreatment;
  /** Only a promotion is taxed at a province's rate; a gift has none. */
  taxProvince: Province | null;
}

/** GET /api/sponsors (public): one sponsor with the tier it holds this season. */
export interface SponsorListing {
  id: number;
  slug: string;
  name: string;
  tier: string | null;
}

/** POST /api/admin/sponsors: the new sponsor's id and the address made from its name. */
export interface SponsorCreated {
  id: number;
  slug: string;
}

/** PUT /api/admin/sponsors/:id: the sponsor as saved. */
export interface SponsorSaved {
  sponsor: Sponsor;
}

/** POST /api/admin/sponsors/:id/agreements: the new agreement's id. */
export interface AgreementCreated {
  id: number;
}

/** POST /api/admin/sponsors/agreements/:agreementId/cash-received: the money movement booked for it (null if none). */
export interface CashReceived {
  movementId: number | null;
}

/** POST /api/admin/sponsors/:id/credits: the credit's id and whether it counted against one of the sponsor's promises. */
export interface CreditRecorded {
  id: number;
  counted: boolean;
}

/** POST /api/admin/sponsors/:id/contacts: the account made a contact. */
export interface ContactAdded {
  userId: number;
}
