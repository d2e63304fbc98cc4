import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { SiteNames } from '../core/site-names';
import { PostList } from '../build-logs/post-list';
import { ProductGrid } from './product-grid';

// Invented names, unlike the demo's, so the text can only have come from /api/site.
const NAMES = { teamName: 'Nozzle & Nylon', clubName: 'Skywhomp Rocketry Club', timeZone: 'America/Winnipeg' };

describe('public headings with the configured names', () => {
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
    TestBed.inject(SiteNames);
    TestBed.inject(HttpTestingController).expectOne('/api/site').flush(NAMES);
  });

  it('should name the configured team on the merch page', () => {
    const fixture = TestBed.createComponent(ProductGrid);
    fixture.detectChanges();
    const lede = (fixture.nativeElement as HTMLElement).querySelector('.lede')!.textContent!;
    expect(lede).toContain('Small print runs made by Nozzle & Nylon.');
    expect(lede).not.toContain('Thrust');
  });

  it('should name the configured team on the build-log list', () => {
    const fixture = TestBed.createComponent(PostList);
    fixture.detectChanges();
    const note = (fixture.nativeElement as HTMLElement).querySelector('header .form-note')!.textContent!;
    expect(note).toContain('How Nozzle & Nylon print, wire and fly their rockets.');
    expect(note).not.toContain('Thrust');
  });
});
