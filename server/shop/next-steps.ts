import { clubTimeInWords, formatDateTime } from '../../contracts/dates/club-dates';
import type { RunState } from './run-state';

/** A run one order has units in, at the moment the order is shown. */
export interface OrderRun {
  name: string;
  state: RunState;
  closesAt: Date;
}

/** What the buyer is told will happen next; pure, the runs' states worked out by the caller at `now`. */
export interface NextStepsInput {
  status: 'pending' | 'paid' | 'failed' | 'packed' | 'shipped';
  pickup: boolean;
  runs: OrderRun[];
  hasStockItems: boolean;
  clubName: string;
  timeZone: string;
}

/**
 * The buyer's next steps in plain words: when each run closes and goes to the printer, that stock items come off
 * the shelf, and how the order reaches them (mailed with tracking, or handed out at the club's launch). Empty for
 * an order that is not paid or has already shipped.
 */
export function nextSteps(i: NextStepsInput): string[] {
  if (i.status !== 'paid' && i.status !== 'packed') return [];
  const lines: string[] = [];
  for (const run of i.runs) {
    if (run.state === 'scheduled' || run.state === 'open' || run.state === 'sold_out') {
      lines.push(
        `${run.name} takes orders until ${formatDateTime(run.closesAt, i.timeZone)} ${clubTimeInWords(i.timeZone)}. The whole run goes to the printer after that, and your order is packed when the prints are back.`,
      );
    } else if (run.state === 'closed') {
      lines.push(`${run.name} has closed and goes to the printer next; your order is packed when the prints are back.`);
    } else if (run.state === 'in_production') {
      lines.push(`${run.name} is at the printer; your order is packed when the prints are back.`);
    } else {
      lines.push(`${run.name} has been printed; your order is packed from it.`);
    }
  }
  if (i.hasStockItems)
    lines.push(
      i.runs.length
        ? 'In-stock items wait for the printed ones, so everything comes together.'
        : 'Everything is in stock, so your order is packed in the coming days.',
    );
  lines.push(
    i.pickup
      ? `It is handed out at the merch table at the next ${i.clubName} launch: bring this receipt or your order number.`
      : 'We e-mail you the carrier and the tracking number the day it ships.',
  );
  return lines;
}
