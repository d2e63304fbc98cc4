import type { StaffAgreement } from '@contracts/sponsors/sponsor-answers';

/** An open build-log promise a published post may count against. */
export interface OpenPromise {
  deliverableId: number;
  season: string;
  promised: number;
  delivered: number;
  dueOn: string;
  overdue: boolean;
}

/**
 * The sponsor's open build-log promises, earliest due first: the first is the one the server counts a credit against
 * when the marker names none (`deliverableToCredit` in server/sponsors/sponsor-ledger.ts), so the dialog preselects it.
 */
export function openPromises(agreements: readonly StaffAgreement[]): OpenPromise[] {
  return agreements
    .flatMap((a) => a.deliverables.map((d) => ({ ...d, season: a.season })))
    .filter((d) => d.kind === 'build_log_credit' && d.delivered < d.promised)
    .sort((a, b) => a.dueOn.localeCompare(b.dueOn) || a.id - b.id)
    .map((d) => ({
      deliverableId: d.id,
      season: d.season,
      promised: d.promised,
      delivered: d.delivered,
      dueOn: d.dueOn,
      overdue: d.overdue,
    }));
}

/**
 * The credit line the Markdown pipeline reads: `%thanks <sponsor-address>`, then ` #<deliverable id>` when a promise
 * is chosen and ` | note` when there is one. Readers see neither the address nor the id, only the card.
 */
export function creditMarker(slug: string, deliverableId: number | null, note: string): string {
  const clean = note.replace(/\s+/g, ' ').trim();
  const head = deliverableId === null ? `%thanks ${slug}` : `%thanks ${slug} #${deliverableId}`;
  return clean ? `${head} | ${clean}` : head;
}
