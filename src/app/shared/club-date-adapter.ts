import type { Provider } from '@angular/core';
import { provideDateFnsAdapter } from '@angular/material-date-fns-adapter';
import { MAT_DATE_LOCALE, type MatDateFormats } from '@angular/material/core';
import { format, isValid, parseISO } from 'date-fns';
import { enCA } from 'date-fns/locale/en-CA';

/**
 * Dates as the club writes them (en-CA, the club is in Manitoba): typed and shown as YYYY-MM-DD, the same form the
 * API takes, with the month and day names of the en-CA locale in the picker.
 */
export const CLUB_DATE_FORMATS: MatDateFormats = {
  parse: { dateInput: ['yyyy-MM-dd', 'yyyy/MM/dd', 'yyyyMMdd'] },
  display: {
    dateInput: 'yyyy-MM-dd',
    monthYearLabel: 'LLL yyyy',
    dateA11yLabel: 'PPPP',
    monthYearA11yLabel: 'LLLL yyyy',
  },
};

/** The Material date adapter in the club's locale, for components with date pickers. */
export function provideClubDates(): Provider[] {
  return [provideDateFnsAdapter(CLUB_DATE_FORMATS), { provide: MAT_DATE_LOCALE, useValue: enCA }];
}

/** A picked date as the API's `YYYY-MM-DD`, or '' for none; the calendar day as picked, never shifted by a zone. */
export function toIsoDate(date: Date | null): string {
  return date && isValid(date) ? format(date, 'yyyy-MM-dd') : '';
}

/** `YYYY-MM-DD` from the API as a local calendar date for the picker; null for none. */
export function fromIsoDate(value: string | null | undefined): Date | null {
  const date = value ? parseISO(value) : null;
  return date && isValid(date) ? date : null;
}
