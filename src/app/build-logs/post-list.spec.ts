import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { RESPONSE_INIT } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { PostList } from './post-list';

/** Lets the answer land and the page render. */
const settle = async () => {
  await new Promise((resolve) => setTimeout(resolve, 0));
  TestBed.tick();
};

describe('PostList when the list does not load', () => {
  it('should say the build logs could not load instead of "no build logs", answer 503, and list them after "Try again"', async () => {
    const response: ResponseInit = {};
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: RESPONSE_INIT, useValue: response },
      ],
    });
    const fixture = TestBed.createComponent(PostList);
    TestBed.tick();
    const http = TestBed.inject(HttpTestingController);
    const list = () => http.expectOne((r) => r.url === '/api/posts');
    list().flush(
      { error: { code: 'internal', message: 'Something went wrong.' } },
      { status: 500, statusText: 'Internal Server Error' },
    );
    // The tag filter failing too leaves the page standing: it only hides the filter.
    http
      .expectOne('/api/posts/tags')
      .flush(
        { error: { code: 'internal', message: 'Something went wrong.' } },
        { status: 500, statusText: 'Internal Server Error' },
      );
    await settle();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('[role="alert"]')!.textContent).toBe('The build logs could not be loaded just now.');
    expect(el.querySelector('ps-empty-state')).toBeNull();
    expect(el.querySelector('nav.tag-filter')).toBeNull();
    expect(response.status).toBe(503);

    Array.from(el.querySelectorAll('button'))
      .find((b) => b.textContent!.trim() === 'Try again')!
      .click();
    TestBed.tick();
    list().flush({
      items: [
        {
          slug: 'first-flight',
          title: 'First flight of the Prairie Dart',
          summary: 'It flew.',
          coverUrl: null,
          publishedAt: '2026-06-01T15:00:00Z',
          tags: [],
          membersOnly: false,
        },
      ],
      total: 1,
    });
    await settle();
    expect(el.querySelector('[role="alert"]')).toBeNull();
    expect(el.querySelector('ol.posts h2')!.textContent).toBe('First flight of the Prairie Dart');
  });
});
