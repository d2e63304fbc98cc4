import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { SiteNames } from './site-names';

describe('SiteNames', () => {
  beforeEach(() => TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] }));

  it('asks once when first needed and holds the names the server gives', () => {
    const names = TestBed.inject(SiteNames);
    expect(names.teamName()).toBe('');
    TestBed.inject(HttpTestingController)
      .expectOne('/api/site')
      .flush({ teamName: 'Nozzle & Nylon', clubName: 'Skywhomp Rocketry Club', timeZone: 'America/Regina' });
    expect(names.teamName()).toBe('Nozzle & Nylon');
    expect(names.clubName()).toBe('Skywhomp Rocketry Club');
    expect(names.timeZone()).toBe('America/Regina');
    expect(names.clubTime()).toBe('club time (Regina)');
  });
});
