import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { CheckIn } from './check-in';

describe('CheckIn', () => {
  beforeEach(() => {
    TestBed.configureTestingModule({ imports: [CheckIn], providers: [provideHttpClient(), provideHttpClientTesting()] });
  });

  async function scan(token: string, answer: object) {
    const fixture = TestBed.createComponent(CheckIn);
    await fixture.whenStable();
    const input: HTMLInputElement = fixture.nativeElement.querySelector('input');
    input.value = token;
    input.dispatchEvent(new Event('input'));
    fixture.nativeElement.querySelector('button[type=submit]').click();
    const req = TestBed.inject(HttpTestingController).expectOne('/api/admin/checkin');
    expect(req.request.body).toEqual({ token });
    req.flush(answer);
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  it('should show a lapsing verdict with the association expiry flagged when not current', async () => {
    const el = await scan('v1.01042.1.abc', { status: 'lapsing', memberNumber: '01042', name: 'Wren Okonkwo', associationExpires: '2026-01-01', associationCurrent: false, termEnd: '2025-12-31', certificationLevel: 'L1' });
    const verdict = el.querySelector('[data-testid=check-in-verdict]')!;
    expect(verdict.textContent).toContain('Lapsing');
    expect(verdict.classList).toContain('warn');
    expect(verdict.textContent).toContain('not current');
  });

  it('should show an unknown card without member details', async () => {
    const el = await scan('junk', { status: 'unknown', memberNumber: null, name: null, associationExpires: null, associationCurrent: null, termEnd: null, certificationLevel: null });
    const verdict = el.querySelector('[data-testid=check-in-verdict]')!;
    expect(verdict.textContent).toContain('Unknown card');
    expect(verdict.querySelector('dl')).toBeNull();
  });
});
