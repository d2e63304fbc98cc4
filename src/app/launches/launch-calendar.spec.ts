import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { RESPONSE_INIT } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { LaunchCalendar, todayIn } from './launch-calendar';

const launch = (id: number, date: string, status: string) => ({
  id,
  title: `Day ${id}`,
  date,
  startsAt: '10:00',
  endsAt: '16:00',
  status,
  statusLabel: status,
  callOffReason: status === 'called_off' ? 'Wind' : null,
  site: { name: 'Coulee Flats Field', address: null, lat: null, lon: null },
  ceilingMetres: null,
  waiverVersion: null,
  notes: '',
  rsvpCount: 2,
});

describe('LaunchCalendar', () => {
  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [LaunchCalendar],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
  });

  it("should list today's closed day with the recent ones and its results, and keep today's open day coming up", async () => {
    const today = todayIn('America/Winnipeg');
    const fixture = TestBed.createComponent(LaunchCalendar);
    fixture.detectChanges();
    TestBed.inject(HttpTestingController)
      .expectOne('/api/launches')
      .flush({
        items: [
          launch(1, '2020-05-02', 'done'),
          launch(2, today, 'done'),
          launch(3, today, 'scheduled'),
          launch(4, '2999-06-01', 'called_off'),
        ],
        timeZone: 'America/Winnipeg',
      });
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    const titles = (list: Element) => Array.from(list.querySelectorAll('h3')).map((h) => h.textContent!.trim());
    const [upcoming, recent] = Array.from(el.querySelectorAll('ul.launches'));
    expect(titles(upcoming)).toEqual(['Day 3', 'Day 4']);
    expect(titles(recent)).toEqual(['Day 2', 'Day 1']);
    expect(recent.querySelector('li')!.textContent).toContain('Results');
  });

  it('should say the calendar could not load, answer 503, and list the days after "Try again" when the API fails', async () => {
    const response: ResponseInit = {};
    TestBed.overrideProvider(RESPONSE_INIT, { useValue: response });
    const fixture = TestBed.createComponent(LaunchCalendar);
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http
      .expectOne('/api/launches')
      .flush(
        { error: { code: 'internal', message: 'Something went wrong.' } },
        { status: 500, statusText: 'Internal Server Error' },
      );
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('[role="alert"]')!.textContent).toBe('The calendar could not be loaded just now.');
    expect(el.querySelector('ps-empty-state')).toBeNull();
    expect(response.status).toBe(503);

    Array.from(el.querySelectorAll('button'))
      .find((b) => b.textContent!.trim() === 'Try again')!
      .click();
    fixture.detectChanges();
    http
      .expectOne('/api/launches')
      .flush({ items: [launch(3, '2999-06-01', 'scheduled')], timeZone: 'America/Winnipeg' });
    await fixture.whenStable();
    expect(el.querySelector('[role="alert"]')).toBeNull();
    expect(Array.from(el.querySelectorAll('ul.launches h3')).map((h) => h.textContent!.trim())).toEqual(['Day 3']);
  });
});
