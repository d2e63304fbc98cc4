/** A run's state as buyers see it, from its stored state, its window and its count. */

export type StoredRunState = 'scheduled' | 'open' | 'closed' | 'in_production' | 'shipped';
export type RunState = StoredRunState | 'sold_out';

export interface RunClock {
  state: StoredRunState;
  cap: number;
  reserved: number;
  opensAt: Date;
  closesAt: Date;
}

/** Staff moves a run forward by hand; before that the window and the cap decide. */
export function effectiveRunState(run: RunClock, now: Date): RunState {
  if (run.state === 'closed' || run.state === 'in_production' || run.state === 'shipped') return run.state;
  if (now < run.opensAt) return 'scheduled';
  if (now >= run.closesAt) return 'closed';
  if (run.reserved >= run.cap) return 'sold_out';
  return 'open';
}

/** The states staff may move a run to from its current effective state. */
export function nextRunStates(state: RunState): StoredRunState[] {
  switch (state) {
    case 'scheduled':
    case 'open':
    case 'sold_out':
      return ['closed'];
    case 'closed':
      return ['in_production'];
    case 'in_production':
      return ['shipped'];
    default:
      return [];
  }
}
