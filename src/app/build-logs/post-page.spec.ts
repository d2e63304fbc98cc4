import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { RESPONSE_INIT } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { PostDetail } from '@contracts/build-logs/post-answers';
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

/** The post with its two markers, answered and rendered; the embeds are made after that render. */
async function openWithMarkers() {
  const fixture = TestBed.createComponent(PostPage);
  fixture.componentRef.setInput('slug', 'first-flight');
  TestBed.tick();
  const http = TestBed.inject(HttpTestingController);
  http.expectOne('/api/posts/first-flight').flush(POST);
  await settle();
  await settle();
  return { fixture, http };
}

describe('PostPage with flight markers', () => {
  beforeAll(() => jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null));
  beforeEach(() => {
    jest.spyOn(console, 'error').mockImplementation(() => undefined);
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
  });
  afterEach(() => (console.error as jest.Mock).mockRestore());

  it('should put each flight chart where its marker was, and a note where there is no data', async () => {
    const { fixture, http } = await openWithMarkers();

    // As GET /api/flights/:id answers (FlightPage): the card, and the analysed log under `data`.
    http.expectOne('/api/flights/5').flush({
      flight: { id: 5, rocketName: 'Prairie Dart' },
      data: {
        summary: {
          apogeeMetres: 412,
          apogeeFeet: 1351.7,
          apogeeAtSeconds: 9.8,
          maxSpeedMps: 88,
          descentRateMps: 4.6,
          peakAccelG: 7.2,
          flightTimeSeconds: 95,
          samples: 9000,
        },
        series: [
          { t: 0, altitudeM: 0, speedMps: 0 },
          { t: 9.8, altitudeM: 412, speedMps: 0 },
        ],
        events: [{ kind: 'apogee', t: 9.8 }],
        mapping: {},
        filter: 'Savitzky–Golay',
        fileName: 'flight.csv',
        uploadedAt: '2026-06-13T18:00:00.000Z',
      },
      caution: 'Padside records.',
    });
    http
      .expectOne('/api/flights/6')
      .flush({ error: { code: 'not_found', message: 'Not found.' } }, { status: 404, statusText: 'Not Found' });
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

describe('PostPage with a flight below the fold', () => {
  /** Stands in for the browser's observer: the test says when a placeholder nears the screen. */
  class NearScreen {
    static last: NearScreen;
    readonly watched = new Set<Element>();
    constructor(private readonly report: (entries: { target: Element; isIntersecting: boolean }[]) => void) {
      NearScreen.last = this;
    }
    observe(target: Element): void {
      this.watched.add(target);
    }
    unobserve(target: Element): void {
      this.watched.delete(target);
    }
    disconnect(): void {
      this.watched.clear();
    }
    near(target: Element): void {
      this.report([{ target, isIntersecting: true }]);
    }
  }
  beforeAll(() => jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null));
  beforeEach(() => {
    (globalThis as { IntersectionObserver?: unknown }).IntersectionObserver = NearScreen;
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
  });
  afterEach(() => delete (globalThis as { IntersectionObserver?: unknown }).IntersectionObserver);

  it('should ask for a flight only once its placeholder nears the screen', async () => {
    const { fixture, http } = await openWithMarkers();
    // Rendered, watched, and not fetched: the chart's code and data wait.
    expect(http.match((r) => r.url.startsWith('/api/flights/'))).toEqual([]);
    const [first, second] = Array.from(
      (fixture.nativeElement as HTMLElement).querySelectorAll<HTMLElement>('.ps-flight'),
    );
    expect([...NearScreen.last.watched]).toEqual([first, second]);

    NearScreen.last.near(first);
    await settle();
    await settle();
    http
      .expectOne('/api/flights/5')
      .flush({ error: { code: 'not_found', message: 'Not found.' } }, { status: 404, statusText: 'Not Found' });
    expect(http.match('/api/flights/6')).toEqual([]);
    expect([...NearScreen.last.watched]).toEqual([second]);
  });
});

describe('PostPage when the post does not load', () => {
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
    const fixture = TestBed.createComponent(PostPage);
    fixture.componentRef.setInput('slug', 'first-flight');
    TestBed.tick();
    return { element: fixture.nativeElement as HTMLElement, http: TestBed.inject(HttpTestingController) };
  }
  const buttons = (element: HTMLElement) =>
    Array.from(element.querySelectorAll('button')).map((b) => b.textContent!.trim());

  it('should say the build log is not found, answer 404 and offer no retry when the API answers 404', async () => {
    const { element, http } = open();
    http
      .expectOne('/api/posts/first-flight')
      .flush({ error: { code: 'not_found', message: 'No such post.' } }, { status: 404, statusText: 'Not Found' });
    await settle();
    expect(element.querySelector('h1')!.textContent).toBe('Build log not found');
    expect(response.status).toBe(404);
    expect(buttons(element)).not.toContain('Try again');
  });

  it('should say it could not load, answer 503, and show the post after "Try again" when the API fails', async () => {
    const { element, http } = open();
    http
      .expectOne('/api/posts/first-flight')
      .flush(
        { error: { code: 'internal', message: 'Something went wrong.' } },
        { status: 500, statusText: 'Internal Server Error' },
      );
    await settle();
    expect(element.querySelector('h1')!.textContent).toBe('This build log could not be loaded');
    expect(element.querySelector('[role="alert"]')!.textContent).toContain('try again in a moment');
    expect(element.textContent).not.toContain('Build log not found');
    expect(response.status).toBe(503);

    Array.from(element.querySelectorAll('button'))
      .find((b) => b.textContent!.trim() === 'Try again')!
      .click();
    TestBed.tick();
    http.expectOne('/api/posts/first-flight').flush({ ...POST, html: '<p>Up it went.</p>' });
    await settle();
    expect(element.querySelector('h1')!.textContent).toBe(POST.title);
    expect(http.match('/api/posts/first-flight')).toEqual([]);
  });

  it('should treat a lost connection like a failure, not like a missing post', async () => {
    const { element, http } = open();
    http
      .expectOne('/api/posts/first-flight')
      .error(new ProgressEvent('error'), { status: 0, statusText: 'Unknown Error' });
    await settle();
    expect(element.querySelector('h1')!.textContent).toBe('This build log could not be loaded');
    expect(response.status).toBe(503);
  });
});
