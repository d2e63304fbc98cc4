import { UNKNOWN_CARD } from '@contracts/membership/check-in-answers';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { By } from '@angular/platform-browser';
import { CameraScanner } from '../../shared/camera-scanner';
import { CheckIn } from './check-in';

describe('CheckIn', () => {
  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [CheckIn],
      providers: [provideHttpClient(), provideHttpClientTesting()],
    });
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

  it('should send the code and show the three answers from the server', async () => {
    const el = await scan('v1.01042.1.abc', {
      status: 'lapsing',
      memberNumber: '01042',
      name: 'Wren Okonkwo',
      mayFly: false,
      termEnd: '2025-12-31',
      dues: { answer: 'grace', termEnd: '2025-12-31' },
      association: { answer: 'expired', number: 'NA-7', expires: '2026-01-01', verified: null },
      certification: { answer: 'none', level: 'none', label: 'No high-power certification', verified: null },
    });
    const verdict = el.querySelector('[data-testid=check-in-verdict]')!;
    expect(verdict.textContent).toContain('Not cleared to fly');
    expect(verdict.textContent).toContain('in grace');
    expect(verdict.textContent).toContain('expired Jan 1, 2026');
  });

  it('should show an unknown card without member details', async () => {
    const el = await scan('junk', UNKNOWN_CARD);
    const verdict = el.querySelector('[data-testid=check-in-verdict]')!;
    expect(verdict.textContent).toContain('Unknown card');
    expect(verdict.querySelector('dl')).toBeNull();
  });

  it('should check a code the camera read as if it were typed', async () => {
    const fixture = TestBed.createComponent(CheckIn);
    await fixture.whenStable();
    fixture.debugElement.query(By.directive(CameraScanner)).componentInstance.scanned.emit('v1.01042.1.abc');
    const req = TestBed.inject(HttpTestingController).expectOne('/api/admin/checkin');
    expect(req.request.body).toEqual({ token: 'v1.01042.1.abc' });
    req.flush(UNKNOWN_CARD);
    await fixture.whenStable();
    expect(
      (fixture.nativeElement as HTMLElement).querySelector('[data-testid=check-in-verdict]')!.textContent,
    ).toContain('Unknown card');
  });
});
