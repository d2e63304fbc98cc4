import type { DeliverableKind } from '../labels/deliverable-kinds';

/** One credit given to a sponsor, as staff and the sponsor's own portal read it. */
export interface SponsorCredit {
  id: number;
  kind: DeliverableKind;
  url: string | null;
  at: string;
  postSlug: string | null;
  postTitle: string | null;
  videoTimestamp: string | null;
  note: string | null;
  /** Whether it counted against one of the sponsor's promises. */
  counted: boolean;
}
