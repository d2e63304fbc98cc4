import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { SponsorCard } from './sponsor-api';
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
  beforeEach(() => TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] }));

  it('should give each logo its stored size, and the logo box (160 x 80) when no size is stored', async () => {
    const fixture = TestBed.createComponent(SponsorWall);
    TestBed.tick();
    TestBed.inject(HttpTestingController)
      .expectOne('/api/sponsors/wall')
      .flush({ season: '2026', tiers: [{ name: 'Launch Pad', sponsors: [card(1, 'Prairie Resin Works', { width: 900, height: 600 }), card(2, 'Coulee Machining', null)] }] });
    await new Promise((resolve) => setTimeout(resolve, 0));
    TestBed.tick();
    const sizes = Array.from((fixture.nativeElement as HTMLElement).querySelectorAll('img.logo')).map((img) => [img.getAttribute('alt'), img.getAttribute('width'), img.getAttribute('height')]);
    expect(sizes).toEqual([
      ['Prairie Resin Works logo', '900', '600'],
      ['Coulee Machining logo', '160', '80'],
    ]);
  });
});
