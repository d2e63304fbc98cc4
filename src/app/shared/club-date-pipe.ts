import { Pipe, PipeTransform, inject } from '@angular/core';
import {
  formatClock,
  formatDate,
  formatDateTime,
  formatDay,
  formatMonth,
  formatTime,
} from '@contracts/dates/club-dates';
import { SiteNames } from '../core/site-names';

/** How much of a moment to show. A stored `YYYY-MM-DD` club date or `HH:MM` club clock time shows as it is. */
export type ClubDateStyle = 'date' | 'dateTime' | 'time';

const DAY = /^\d{4}-\d{2}-\d{2}$/;
const CLOCK = /^\d{2}:\d{2}$/;
const MONTH = /^\d{4}-\d{2}$/;

/**
 * Dates and times in the one club format, in club time, never with seconds: `{{ at | clubDate: 'dateTime' }}` ->
 * "Mar 8, 2026, 4:30 a.m."; `{{ '2026-03-08' | clubDate }}` -> "Mar 8, 2026"; `{{ '17:30' | clubDate }}` -> "5:30 p.m."; `{{ '2026-12' | clubDate }}` -> "Dec 2026".
 * The e-mails use the same module.
 */
@Pipe({ name: 'clubDate' })
export class ClubDatePipe implements PipeTransform {
  private readonly site = inject(SiteNames);

  transform(value: Date | string | null | undefined, style: ClubDateStyle = 'date'): string {
    if (value === null || value === undefined || value === '') return '';
    if (typeof value === 'string' && DAY.test(value)) return formatDay(value);
    if (typeof value === 'string' && CLOCK.test(value)) return formatClock(value);
    if (typeof value === 'string' && MONTH.test(value)) return formatMonth(value);
    const zone = this.site.timeZone();
    return style === 'dateTime'
      ? formatDateTime(value, zone)
      : style === 'time'
        ? formatTime(value, zone)
        : formatDate(value, zone);
  }
}
