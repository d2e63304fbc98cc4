/** A print run's state as buyers and staff see it: the stored states plus `sold_out`, worked out from the count. */
export type RunState = 'scheduled' | 'open' | 'sold_out' | 'closed' | 'in_production' | 'shipped';

export const RUN_STATE_LABELS: Readonly<Record<RunState, string>> = {
  scheduled: 'Opens soon',
  open: 'Taking orders',
  sold_out: 'Sold out',
  closed: 'Window closed',
  in_production: 'Being printed',
  shipped: 'Shipped',
};

/** The button that moves a run to a state by hand. */
export const RUN_MOVE_LABELS: Readonly<Record<'closed' | 'in_production' | 'shipped', string>> = {
  closed: 'Close now',
  in_production: 'Send to the printer',
  shipped: 'Mark shipped',
};
