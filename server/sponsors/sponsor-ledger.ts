import { DELIVERABLE_KINDS, type DeliverableKind } from '../../contracts/labels/deliverable-kinds';
import type { DeliverableLine, KindSummary } from '../../contracts/sponsors/sponsor-answers';

export { DELIVERABLE_KINDS, type DeliverableKind };

export interface DeliverableInput {
  id: number;
  kind: DeliverableKind;
  quantity: number;
  dueOn: string;
  /** Live (not withdrawn) credits recorded against it. */
  delivered: number;
  /** True when the sponsor stands on the public sponsors page now and this promise is of the season shown there. */
  listedNow?: boolean;
}

/**
 * Overdue: due before today and still short of what was promised. A deliverable due today is not overdue yet.
 * A sponsors-page listing is delivered while it stands: when the sponsor is on the public page now, the promise
 * of the season shown there counts in full, whatever was recorded by hand.
 */
export function ledgerLines(deliverables: readonly DeliverableInput[], today: string): DeliverableLine[] {
  return [...deliverables]
    .sort((a, b) => a.dueOn.localeCompare(b.dueOn) || a.id - b.id)
    .map((d) => {
      const listedNow = d.kind === 'sponsors_page' && d.listedNow === true;
      const delivered = listedNow ? Math.max(d.delivered, d.quantity) : d.delivered;
      return {
        id: d.id,
        kind: d.kind,
        promised: d.quantity,
        delivered,
        dueOn: d.dueOn,
        overdue: delivered < d.quantity && d.dueOn < today,
        listedNow,
      };
    });
}

/** Promised vs delivered per kind, in the order of DELIVERABLE_KINDS, only kinds that were promised. */
export function summaryByKind(lines: readonly DeliverableLine[]): KindSummary[] {
  return DELIVERABLE_KINDS.flatMap((kind) => {
    const of = lines.filter((l) => l.kind === kind);
    return of.length
      ? [{ kind, promised: of.reduce((s, l) => s + l.promised, 0), delivered: of.reduce((s, l) => s + l.delivered, 0) }]
      : [];
  });
}

/** The earliest open deliverable due today or later; overdue ones are listed separately. */
export function nextDue(lines: readonly DeliverableLine[], today: string): DeliverableLine | null {
  return lines.find((l) => l.delivered < l.promised && l.dueOn >= today) ?? null;
}

/**
 * Among one sponsor's open deliverables of a kind, the one a new credit counts against: the one the author named
 * (`preferredId`, from a credit marker's `#id`) when it is among them, of that kind and still open; otherwise the
 * earliest due. A named one that is of another sponsor, another kind or already delivered in full thus falls back
 * rather than failing the publish: the credit still lands on a promise that is owed.
 */
export function deliverableToCredit<
  T extends { id: number; kind: string; quantity: number; dueOn: string; delivered: number },
>(deliverables: readonly T[], kind: string, preferredId: number | null = null): T | null {
  const open = deliverables.filter((d) => d.kind === kind && d.delivered < d.quantity);
  return (
    open.find((d) => d.id === preferredId) ??
    [...open].sort((a, b) => a.dueOn.localeCompare(b.dueOn) || a.id - b.id)[0] ??
    null
  );
}
