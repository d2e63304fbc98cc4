import { HttpClient, HttpContext } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import { QUIET_ERRORS } from '../core/error-interceptor';

/** Padside's labels for deliverable kinds (shared with e-mails, reports and CSVs). */
import type { DeliverableKind } from '@contracts/labels/deliverable-kinds';

export { DELIVERABLE_KIND_LABELS as KIND_LABELS, type DeliverableKind } from '@contracts/labels/deliverable-kinds';

export interface SponsorCard {
  id: number;
  slug: string;
  name: string;
  website: string | null;
  blurb: string | null;
  logoUrl: string | null;
  /** The stored logo's size in pixels; null when there is no uploaded logo. */
  logoSize: { width: number; height: number } | null;
  posts: { slug: string; title: string }[];
}

export interface DeliverableLine {
  id: number;
  kind: DeliverableKind;
  promised: number;
  delivered: number;
  dueOn: string;
  overdue: boolean;
  /** A sponsors-page listing delivered by the sponsor standing on the public page now. */
  listedNow: boolean;
}

export interface Agreement {
  id: number;
  season: string;
  cashCents: number;
  cashReceivedOn: string | null;
  /** The promised cash once staff recorded it as received, else 0; the PDF report prints the same. */
  cashReceivedCents: number;
  /** promotion: taxed at the sponsor province's GST/HST; gift: no tax. */
  taxTreatment?: 'promotion' | 'gift';
  taxProvince?: string | null;
  inKind: { id: number; description: string; valueCents: number; receivedOn: string | null }[];
  inKindCents: number;
  totalCents: number;
  note: string | null;
  deliverables: DeliverableLine[];
  byKind: { kind: DeliverableKind; promised: number; delivered: number }[];
  overdue: DeliverableLine[];
  nextDue: DeliverableLine | null;
}

export interface PortalCredit {
  kind: DeliverableKind;
  url: string | null;
  at: string;
  postSlug?: string;
  postTitle?: string;
  note: string | null;
  videoTimestamp: string | null;
}

export interface PortalView {
  sponsor: { id: number; slug: string; name: string; website: string | null; blurb: string | null; logoUrl: string | null };
  agreements: Agreement[];
  credits: PortalCredit[];
}

/** The public sponsors page and the sponsor's own portal. */
@Injectable({ providedIn: 'root' })
export class SponsorApi {
  private readonly http = inject(HttpClient);

  wall(): Observable<{ season: string; tiers: { name: string; sponsors: SponsorCard[] }[] }> {
    return this.http.get<{ season: string; tiers: { name: string; sponsors: SponsorCard[] }[] }>('/api/sponsors/wall');
  }

  /** Quiet: a sponsor account not linked yet gets a message on the page, not a snack bar. */
  portal(): Observable<PortalView> {
    return this.http.get<PortalView>('/api/sponsor-portal/me', { context: new HttpContext().set(QUIET_ERRORS, true) });
  }
}
