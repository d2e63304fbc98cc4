/** "3 days 4 h left" style wording for the time until `until`, from `now`. */
export function timeLeft(until: string, now: number): string {
  const ms = new Date(until).getTime() - now;
  if (ms <= 0) return 'closed';
  const mins = Math.floor(ms / 60000);
  const days = Math.floor(mins / 1440);
  const hours = Math.floor((mins % 1440) / 60);
  if (days > 0) return `${days} day${days === 1 ? '' : 's'} ${hours} h left`;
  if (hours > 0) return `${hours} h ${mins % 60} min left`;
  return `${mins} min left`;
}

/** How a run's state reads on a card (shared with the console and CSVs). */
export { RUN_STATE_LABELS } from '@contracts/labels/run-states';
