import { TestBed } from '@angular/core/testing';
import { SiteNames } from '../core/site-names';
import { ClubDatePipe } from './club-date-pipe';

describe('ClubDatePipe', () => {
  function pipeIn(timeZone: string): ClubDatePipe {
    TestBed.configureTestingModule({ providers: [{ provide: SiteNames, useValue: { timeZone: () => timeZone } }] });
    return TestBed.runInInjectionContext(() => new ClubDatePipe());
  }

  // IANA tz database, northamerica, Rule Canada: Winnipeg goes to daylight time at 08:00 UTC on 2026-03-08.
  it('shows an instant in the club zone to the minute', () => {
    const pipe = pipeIn('America/Winnipeg');
    expect(pipe.transform('2026-03-08T08:00:42Z', 'dateTime')).toBe('Mar 8, 2026, 3:00 a.m.');
    expect(pipe.transform('2026-03-08T07:59:42Z', 'time')).toBe('1:59 a.m.');
    expect(pipe.transform('2026-03-08T05:59:00Z')).toBe('Mar 7, 2026');
  });

  it('shows a stored club date as it is, and nothing for no value', () => {
    const pipe = pipeIn('Pacific/Auckland');
    expect(pipe.transform('2026-03-08')).toBe('Mar 8, 2026');
    expect(pipe.transform('17:30')).toBe('5:30 p.m.');
    expect(pipe.transform(null)).toBe('');
  });
});
