import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { FlightCardForm } from './flight-card-form';

describe('FlightCardForm', () => {
  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [FlightCardForm],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
  });

  async function filled() {
    const fixture = TestBed.createComponent(FlightCardForm);
    fixture.componentRef.setInput('id', '7');
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/launches/7').flush({
      launch: { id: 7, title: 'Summer fly day' },
      me: { going: true, checkedIn: true },
      timeZone: 'America/Winnipeg',
    });
    await fixture.whenStable();
    const el: HTMLElement = fixture.nativeElement;
    const type = (selector: string, value: string) => {
      const input = el.querySelector<HTMLInputElement>(selector)!;
      input.value = value;
      input.dispatchEvent(new Event('input'));
    };
    type('input[formcontrolname=rocketName]', 'Filament Falcon');
    type('input[formcontrolname=liftoffMassGrams]', '120');
    type('fieldset input', 'C6-5');
    await fixture.whenStable();
    return { fixture, el, http };
  }

  it('should show the server message beside the motor it could not read', async () => {
    const { fixture, el, http } = await filled();
    el.querySelector<HTMLButtonElement>('button[type=submit]')!.click();
    fixture.detectChanges();
    const req = http.expectOne('/api/launches/7/flights');
    expect(req.request.body).toEqual(
      expect.objectContaining({ rocketName: 'Filament Falcon', liftoffMassGrams: 120, motors: ['C6-5'] }),
    );
    req.flush(
      {
        error: {
          code: 'invalid_request',
          message: 'A motor designation could not be read.',
          fields: { 'motors.0': 'Padside cannot read "C6-5x".' },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    fixture.detectChanges();
    expect(el.querySelector('[role=alert]')!.textContent).toContain('could not be read');
    expect(el.querySelector('fieldset mat-error')!.textContent).toContain('Padside cannot read');
  });

  it('should show the warnings in words once the card is filed', async () => {
    const { fixture, el, http } = await filled();
    el.querySelector<HTMLButtonElement>('button[type=submit]')!.click();
    http.expectOne('/api/launches/7/flights').flush({
      flight: {
        id: 31,
        status: 'filed',
        statusLabel: 'Waiting at the table',
        rocketName: 'Filament Falcon',
        thrustToWeight: 2.4,
        motors: [
          {
            designation: 'C6-5',
            impulseClass: 'C',
            averageThrustN: 6,
            delayS: 5,
            plugged: false,
            totalImpulseMinNs: 5.01,
            totalImpulseMaxNs: 10,
          },
        ],
        warnings: [{ code: 'low_thrust_to_weight', message: 'The motors push about 2.4 times the weight.' }],
      },
      caution: '',
    });
    await fixture.whenStable();
    fixture.detectChanges();
    expect(el.querySelector('[data-testid=card-warnings]')!.textContent).toContain('2.4 times');
    expect(el.querySelector('[data-testid=filed-card]')!.textContent).toContain('5 s delay');
    expect(el.textContent).toContain('range safety officer');
  });
});
