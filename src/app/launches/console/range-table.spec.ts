import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { By } from '@angular/platform-browser';
import { CameraScanner } from '../../shared/camera-scanner';
import { provideRouter } from '@angular/router';
import { RangeTable } from './range-table';

const card = (id: number, over: object = {}) => ({
  id,
  launchId: 4,
  launchTitle: 'Summer fly day',
  launchDate: '2031-05-10',
  flyer: { userId: 9, name: 'Odalys Prairie', certificationLevel: 'none' },
  rocketName: `Rocket ${id}`,
  postSlug: null,
  liftoffMassGrams: 1800,
  motors: [
    {
      designation: 'H128W-M',
      impulseClass: 'H',
      averageThrustN: 128,
      delayS: null,
      plugged: false,
      totalImpulseMinNs: 160.01,
      totalImpulseMaxNs: 320,
    },
  ],
  expectedAltitudeMetres: 500,
  recovery: 'dual_deploy',
  pad: '5',
  notes: '',
  thrustToWeight: 7.25,
  warnings: [{ code: 'beyond_certification', message: 'No verified high-power certification is on record.' }],
  needsHighPower: true,
  status: 'filed',
  statusLabel: 'Waiting at the table',
  decisionReason: null,
  outcome: null,
  outcomeLabel: null,
  outcomeNotes: null,
  apogeeMetres: null,
  ...over,
});

describe('RangeTable', () => {
  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [RangeTable],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
  });

  async function open() {
    const fixture = TestBed.createComponent(RangeTable);
    fixture.componentRef.setInput('id', '4');
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/admin/launches/4/queue').flush({
      launch: {
        id: 4,
        title: 'Summer fly day',
        date: '2031-05-10',
        startsAt: '10:00',
        endsAt: '16:00',
        ceilingMetres: 900,
      },
      caution: 'Padside only keeps the record.',
      pads: [{ pad: '5', items: [card(11)] }],
    });
    await fixture.whenStable();
    return { fixture, http, el: fixture.nativeElement as HTMLElement };
  }

  it('should show the cards by pad with the warnings and the caution', async () => {
    const { el } = await open();
    expect(el.querySelector('.pad')!.textContent).toContain('Pad 5');
    expect(el.querySelector('[data-testid=queue-card-11]')!.textContent).toContain(
      'No verified high-power certification',
    );
    expect(el.querySelector('[role=note]')!.textContent).toContain('range safety officer decides');
  });

  it('should show the refusal on the card when Padside will not record it as cleared', async () => {
    const { fixture, http, el } = await open();
    const approve = Array.from(el.querySelectorAll<HTMLButtonElement>('[data-testid=queue-card-11] button')).find((b) =>
      b.textContent!.includes('Approve'),
    )!;
    approve.click();
    fixture.detectChanges();
    const req = http.expectOne('/api/admin/flights/11/decision');
    expect(req.request.body).toEqual({ approve: true, reason: undefined });
    req.flush(
      { error: { code: 'not_certified', message: "This card goes beyond the flyer's verified certification level." } },
      { status: 409, statusText: 'Conflict' },
    );
    await fixture.whenStable();
    fixture.detectChanges();
    expect(el.querySelector('[data-testid=queue-card-11] [role=alert]')!.textContent).toContain('beyond the flyer');
  });

  it('should send a card back with the reason typed', async () => {
    const { fixture, http, el } = await open();
    const reason = el.querySelector<HTMLInputElement>('[data-testid=queue-card-11] .send-back input')!;
    reason.value = 'Fins loose';
    reason.dispatchEvent(new Event('input'));
    Array.from(el.querySelectorAll<HTMLButtonElement>('[data-testid=queue-card-11] button'))
      .find((b) => b.textContent!.includes('Send back'))!
      .click();
    fixture.detectChanges();
    const req = http.expectOne('/api/admin/flights/11/decision');
    expect(req.request.body).toEqual({ approve: false, reason: 'Fins loose' });
    req.flush({ flight: card(11, { status: 'sent_back', decisionReason: 'Fins loose' }) });
    await new Promise((r) => setTimeout(r));
    fixture.detectChanges();
    // The queue is read again so the card shows its new state.
    http.expectOne('/api/admin/launches/4/queue');
  });

  it('should check in the member whose card the camera read', async () => {
    const { fixture, http, el } = await open();
    fixture.debugElement.query(By.directive(CameraScanner)).componentInstance.scanned.emit('v1.00042.1.abc');
    const req = http.expectOne('/api/launches/4/check-in');
    expect(req.request.body).toEqual({ token: 'v1.00042.1.abc' });
    req.flush({
      checkedIn: true,
      alreadyCheckedIn: false,
      member: { memberNumber: '00042', name: 'Odalys Prairie', status: 'active', certificationLevel: 'L1' },
    });
    await fixture.whenStable();
    fixture.detectChanges();
    expect(el.querySelector('[data-testid=check-in-answer]')!.textContent).toContain(
      'Checked in: Odalys Prairie (00042)',
    );
  });
});
