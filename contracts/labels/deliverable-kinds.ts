/** Kinds of deliverable a sponsor can be promised (the `agreement_deliverables.kind` codes). */
export const DELIVERABLE_KINDS = [
  'build_log_credit',
  'video_mention',
  'logo_on_merch',
  'sponsors_page',
  'social_post',
] as const;
export type DeliverableKind = (typeof DELIVERABLE_KINDS)[number];

/** Padside's words for each kind of deliverable. */
export const DELIVERABLE_KIND_LABELS: Readonly<Record<DeliverableKind, string>> = {
  build_log_credit: 'Build log credit',
  video_mention: 'Video mention',
  logo_on_merch: 'Logo on merch',
  sponsors_page: 'Sponsors page listing',
  social_post: 'Social post',
};

/** Where a promised deliverable stands today. */
export type DeliverableState = 'open' | 'done' | 'overdue';

export const DELIVERABLE_STATE_LABELS: Readonly<Record<DeliverableState, string>> = {
  open: 'Open',
  done: 'Done',
  overdue: 'Overdue',
};

/** Done once delivered in full; overdue when short of it after the due date. */
export function deliverableState(line: { promised: number; delivered: number; overdue: boolean }): DeliverableState {
  if (line.delivered >= line.promised) return 'done';
  return line.overdue ? 'overdue' : 'open';
}
