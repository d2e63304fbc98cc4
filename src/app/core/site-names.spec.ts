import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { SiteNames } from './site-names';

describe('SiteNames', () => {
  beforeEach(() => TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] }));

  it('holds the names the server gives', async () => {
    const names = TestBed.inject(SiteNames);
    const loading = names.load();
    TestBed.inject(HttpTestingController).expectOne('/api/site').flush({ teamName: 'Nozzle & Nylon', clubName: 'Skywhomp Rocketry Club' });
    await loading;
    expect(names.teamName()).toBe('Nozzle & Nylon');
    expect(names.clubName()).toBe('Skywhomp Rocketry Club');
  });
});
