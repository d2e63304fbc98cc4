import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { RESPONSE_INIT } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { SponsorCard } from '@contracts/sponsors/sponsor-answers';
import { SponsorWall } from './sponsor-wall';

const card = (id: number, name: string, logoSize: SponsorCard['logoSize']): SponsorCard => ({
  id,
  slug: `sponsor-${id}`,
  name,
  website: null,
  blurb: null,
  logoUrl: `/uploads/logo${id}.png`,
  logoSize,
  posts: [],
});

describe('SponsorWall logos', () => {
  beforeEach(() =>
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] }),
  );

  it('should give each logo its stored size, and the logo box (160 x 80) when no size is stored', async () => {
    const fixture = TestBed.createComponent(SponsorWall);
    TestBed.tick();
    TestBed.inject(HttpTestingController)
      .expectOne('/api/sponsors/wall')
      .flush({
        season: '2026',
        tiers: [
          {
            name: 'Launch Pad',
            sponsors: [card(1, 'Prairie Resin Works', { width: 900, height: 600 }), card(2, 'Coulee Machining', null)],
          },
        ],
      });
    await new Promise((resolve) => setTimeout(resolve, 0));
    TestBed.tick();
    const sizes = Array.from((fixture.nativeElement as HTMLElement).querySelectorAll('img.logo')).map((img) => [
      img.getAttribute('alt'),
      img.getAttribute('width'),
      img.getAttribute('height'),
    ]);
    expect(sizes).toEqual([
      ['Prairie Resin Works logo', '900', '600'],
      ['Coulee Machining logo', '160', '80'],
    ]);
  });

  it('should say the sponsors could not load instead of "no sponsors", answer 503, and show them after "Try again"', async () => {
    const response: ResponseInit = {};
    TestBed.overrideProvider(RESPONSE_INIT, { useValue: response });
    const fixture = TestBed.createComponent(SponsorWall);
    TestBed.tick();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/sponsors/wall').error(new ProgressEvent('error'), { status: 0, statusText: 'Unknown Error' });
    await new Promise((resolve) => setTimeout(resolve, 0));
    TestBed.tick();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('[role="alert"]')!.textContent).toBe('The sponsors could not be loaded just now.');
    expect(el.querySelector('ps-empty-state')).toBeNull();
    expect(response.status).toBe(503);

    Array.from(el.querySelectorAll('button'))
      .find((b) => b.textContent!.trim() === 'Try again')!
      .click();
    TestBed.tick();
    http
      .expectOne('/api/sponsors/wall')
      .flush({ season: '2026', tiers: [{ name: 'Launch Pad', sponsors: [card(1, 'Prairie Resin Works', null)] }] });
    await new Promise((resolve) => setTimeout(resolve, 0));
    TestBed.tick();
    expect(el.querySelector('[role="alert"]')).toBeNull();
    expect(el.querySelector('h3')!.textContent).toBe('Prairie Resin Works');
  });
});
