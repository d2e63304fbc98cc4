import type { DateRange } from '../../contracts/books/books-schemas';
import { badRequest } from '../platform/app-error';

const MAX_DAYS = 3700;

/** Refuses an inverted or decade-long range with a field message. */
export function checkRange(range: DateRange): DateRange {
  const days = (Date.parse(range.to) - Date.parse(range.from)) / 86_400_000;
  if (days < 0) throw badRequest('The period ends before it starts.', { to: 'Must be on or after the start date.' });
  if (days > MAX_DAYS) throw badRequest('Choose a period of at most ten years.', { from: 'Period too long.' });
  return range;
}
