import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { PostDetail } from './build-log-api';
import { PostPage } from './post-page';

const POST: PostDetail = {
  slug: 'first-flight',
  title: 'First flight of the Prairie Dart',
  summary: 'It flew.',
  coverUrl: null,
  publishedAt: '2026-06-01T15:00:00Z',
  tags: [],
  membersOnly: false,
  author: null,
  // As the server's Markdown pipeline renders `%flight 5` and `%flight 6`.
  html:
    '<p>Up it went.</p>\n<div class="ps-flight" data-flight="5"><p class="ps-flight-note">Flight data: altitude and speed chart for flight 5.</p></div>\n' +
    '<p>Then the second one.</p>\n<div class="ps-flight" data-flight="6"><p class="ps-flight-note">Flight data: altitude and speed chart for flight 6.</p></div>\n',
  credits: [],
  hazardNotice: false,
};

/** Lets the answer land and the page render, without waiting on the requests still open. */
const settle = async () => {
  await new Promise((resolve) => setTimeout(resolve, 0));
  TestBed.tick();
};

describe('PostPage with flight markers', () => {
  beforeAll(() => jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null));
  beforeEach(() => {
    jest.spyOn(console, 'error').mockImplementation(() => undefined);
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
  });
  afterEach(() => (console.error as jest.Mock).mockRestore());

  it('should put each flight chart where its marker was, and a note where there is no data', async () => {
    const fixture = TestBed.createComponent(PostPage);
    fixture.componentRef.setInput('slug', 'first-flight');
    TestBed.tick();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/posts/first-flight').flush(POST);
    // The body renders, then the embeds are made after that render and ask for their flights.
    await settle();
    await settle();

    http.expectOne('/api/flights/5').flush({
      flight: { id: 5, rocketName: 'Prairie Dart' },
      summary: { apogeeMetres: 412, apogeeFeet: 1351.7, apogeeAtSeconds: 9.8, maxSpeedMps: 88, descentRateMps: 4.6, peakAccelG: 7.2, flightTimeSeconds: 95, samples: 9000 },
      series: [
        { t: 0, altitudeM: 0, speedMps: 0 },
        { t: 9.8, altitudeM: 412, speedMps: 0 },
      ],
      events: [{ kind: 'apogee', t: 9.8 }],
    });
    http.expectOne('/api/flights/6').flush({ error: { code: 'not_found', message: 'Not found.' } }, { status: 404, statusText: 'Not Found' });
    await fixture.whenStable();

    const body = (fixture.nativeElement as HTMLElement).querySelector('.body')!;
    const [first, second] = Array.from(body.querySelectorAll<HTMLElement>('.ps-flight'));
    expect(first.tagName).toBe('DIV');
    expect(first.textContent).toContain('412 m');
    expect(first.textContent).toContain('7.2 g');
    expect(first.querySelector('canvas')).not.toBeNull();
    expect(first.textContent).not.toContain('altitude and speed chart for flight 5');
    expect(second.textContent).toContain('Flight data not available.');
    // The text around the markers stays where it was.
    expect(body.firstElementChild!.textContent).toBe('Up it went.');
    expect(first.nextElementSibling!.textContent).toBe('Then the second one.');
  });
});
