import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import type { FlightPage, FlightView } from '@contracts/launches/launch-answers';
import { FlightEmbed } from './flight-embed';

// Only the card's fields the embed reads; the rest of a FlightView does not matter here.
const FLIGHT = { id: 5, rocketName: 'Prairie Dart' } as FlightView;
const DATA: NonNullable<FlightPage['data']> = {
  summary: {
    apogeeMetres: 634.86,
    apogeeFeet: 2082.9,
    apogeeAtSeconds: 12.697,
    maxSpeedMps: 100,
    descentRateMps: 5,
    peakAccelG: null,
    flightTimeSeconds: 139.6,
    samples: 14500,
  },
  series: [
    { t: 0, altitudeM: 0, speedMps: 0 },
    { t: 12.7, altitudeM: 634.86, speedMps: 0 },
  ],
  events: [{ kind: 'apogee', t: 12.697 }],
  mapping: {},
  filter: 'Savitzky–Golay',
  fileName: 'flight.csv',
  uploadedAt: '2026-06-13T18:00:00.000Z',
};
const DETAIL: FlightPage = { flight: FLIGHT, data: DATA, caution: 'Padside records.' };

describe('FlightEmbed', () => {
  beforeAll(() => jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null));
  beforeEach(() => {
    jest.spyOn(console, 'error').mockImplementation(() => undefined);
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
  });
  afterEach(() => (console.error as jest.Mock).mockRestore());

  const show = async (answer: (req: ReturnType<HttpTestingController['expectOne']>) => void) => {
    const fixture = TestBed.createComponent(FlightEmbed);
    fixture.componentRef.setInput('flightId', 5);
    TestBed.tick();
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('Loading flight data');
    answer(TestBed.inject(HttpTestingController).expectOne('/api/flights/5'));
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  };

  it('should show the summary and the chart', async () => {
    const el = await show((req) => req.flush(DETAIL));
    expect(el.querySelector('h3')!.textContent).toContain('Prairie Dart');
    expect(el.textContent).toContain('635 m (2,083 ft) at 12.7 s');
    expect(el.textContent).toContain('100 m/s');
    expect(el.textContent).toContain('5.0 m/s');
    expect(el.textContent).not.toContain('Peak acceleration');
    expect(el.querySelector('ps-flight-chart canvas')).not.toBeNull();
  });

  it('should say the data is not available for a flight with no log yet', async () => {
    const el = await show((req) => req.flush({ ...DETAIL, data: null }));
    expect(el.textContent).toContain('Flight data not available.');
    expect(el.querySelector('ps-flight-chart')).toBeNull();
  });

  it('should say the data is not available for a log with no points to chart', async () => {
    const el = await show((req) => req.flush({ ...DETAIL, data: { ...DATA, series: [] } }));
    expect(el.textContent).toContain('Flight data not available.');
    expect(el.querySelector('ps-flight-chart')).toBeNull();
  });

  it('should say the data is not available on a 404', async () => {
    const el = await show((req) =>
      req.flush({ error: { code: 'not_found', message: 'Not found.' } }, { status: 404, statusText: 'Not Found' }),
    );
    expect(el.textContent).toContain('Flight data not available.');
  });
});
