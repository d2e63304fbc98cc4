import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { RESPONSE_INIT } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { LaunchPage } from './launch-page';

const LAUNCH = {
  id: 5,
  title: 'Spring shoot',
  date: '2031-05-10',
  startsAt: '10:00',
  endsAt: '16:00',
  status: 'scheduled',
  statusLabel: 'On',
  callOffReason: null,
  site: { name: 'Coulee Flats Field', address: null, lat: null, lon: null },
  ceilingMetres: null,
  waiverVersion: null,
  notes: '',
  rsvpCount: 2,
};

/** Lets the answer land and the page render. */
const settle = async () => {
  await new Promise((resolve) => setTimeout(resolve, 0));
  TestBed.tick();
};

describe('LaunchPage when the launch day does not load', () => {
  // Stands in for the server render's response (RESPONSE_INIT), whose status the page sets.
  let response: ResponseInit;
  beforeEach(() => {
    response = {};
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: RESPONSE_INIT, useValue: response },
      ],
    });
  });

  function open(): { element: HTMLElement; http: HttpTestingController } {
    const fixture = TestBed.createComponent(LaunchPage);
    fixture.componentRef.setInput('id', '5');
    TestBed.tick();
    return { element: fixture.nativeElement as HTMLElement, http: TestBed.inject(HttpTestingController) };
  }
  const buttons = (element: HTMLElement) =>
    Array.from(element.querySelectorAll('button')).map((b) => b.textContent!.trim());

  it('should say the launch day is not found, answer 404 and offer no retry when the API answers 404', async () => {
    const { element, http } = open();
    http
      .expectOne('/api/launches/5')
      .flush({ error: { code: 'not_found', message: 'No such launch.' } }, { status: 404, statusText: 'Not Found' });
    await settle();
    expect(element.querySelector('h1')!.textContent).toBe('Launch day not found');
    expect(response.status).toBe(404);
    expect(buttons(element)).not.toContain('Try again');
  });

  it('should say it could not load, answer 503, and show the launch day after "Try again" when the API fails', async () => {
    const { element, http } = open();
    http
      .expectOne('/api/launches/5')
      .flush(
        { error: { code: 'internal', message: 'Something went wrong.' } },
        { status: 503, statusText: 'Service Unavailable' },
      );
    await settle();
    expect(element.querySelector('h1')!.textContent).toBe('This launch day could not be loaded');
    expect(element.querySelector('[role="alert"]')!.textContent).toContain('try again in a moment');
    expect(element.textContent).not.toContain('not found');
    expect(response.status).toBe(503);

    Array.from(element.querySelectorAll('button'))
      .find((b) => b.textContent!.trim() === 'Try again')!
      .click();
    TestBed.tick();
    http.expectOne('/api/launches/5').flush({ launch: LAUNCH, me: null, timeZone: 'America/Winnipeg' });
    await settle();
    expect(element.querySelector('h1')!.textContent).toBe('Spring shoot');
    expect(http.match('/api/launches/5')).toEqual([]);
  });

  it('should treat a lost connection like a failure, not like a missing launch day', async () => {
    const { element, http } = open();
    http.expectOne('/api/launches/5').error(new ProgressEvent('error'), { status: 0, statusText: 'Unknown Error' });
    await settle();
    expect(element.querySelector('h1')!.textContent).toBe('This launch day could not be loaded');
    expect(response.status).toBe(503);
  });
});
