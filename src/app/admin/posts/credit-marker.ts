import type { StaffAgreement } from '../sponsors/sponsor-admin-api';

/** The open build-log promise a published post counts against. */
export interface CountedPromise {
  season: string;
  promised: number;
  delivered: number;
  dueOn: string;
  overdue: boolean;
}

/**
 * The server counts a post's credit against the sponsor's earliest-due open build-log promise
 * (`deliverableToCredit` in server/sponsors/sponsor-ledger.ts); this finds the same one for the dialog.
 */
export function promiseCounted(agreements: readonly StaffAgreement[]): CountedPromise | null {
  const open = agreements
    .flatMap((a) => a.deliverables.map((d) => ({ ...d, season: a.season })))
    .filter((d) => d.kind === 'build_log_credit' && d.delivered < d.promised)
    .sort((a, b) => a.dueOn.localeCompare(b.dueOn) || a.id - b.id)[0];
  return open ? { season: open.season, promised: open.promised, delivered: open.delivered, dueOn: open.dueOn, overdue: open.overdue } : null;
}

/** The credit line the Markdown pipeline reads: `%thanks <sponsor-address>`, with ` | note` when there is one. */
export function creditMarker(slug: string, note: string): string {
  const clean = note.replace(/\s+/g, ' ').trim();
  return clean ? `%thanks ${slug} | ${clean}` : `%thanks ${slug}`;
}
