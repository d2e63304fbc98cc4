import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import type { Product } from '@contracts/shop/shop-answers';
import { RunForm } from './run-form';

const shirt = {
  id: 7,
  name: 'Season shirt',
  variants: [
    { id: 71, label: 'M' },
    { id: 72, label: 'L' },
  ],
  run: { id: 3 },
} as unknown as Product;

describe('RunForm', () => {
  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [RunForm],
      providers: [provideHttpClient(), provideHttpClientTesting()],
    });
  });

  async function filled() {
    const fixture = TestBed.createComponent(RunForm);
    fixture.componentRef.setInput('products', [shirt]);
    fixture.componentRef.setInput('timeZone', 'America/Winnipeg');
    await fixture.whenStable();
    const form = (fixture.componentInstance as unknown as { form: RunForm['form'] }).form;
    form.controls.productId.setValue(7);
    form.patchValue({ cap: '40', opensAt: '2027-03-01T09:00', closesAt: '2027-03-21T21:30', unitCost: '8.75' });
    form.controls.variantCaps.at(1).controls.cap.setValue('12');
    await fixture.whenStable();
    return fixture;
  }

  it('should send the window in club time, the cost in cents and only the size caps that were filled', async () => {
    const fixture = await filled();
    const el: HTMLElement = fixture.nativeElement;
    expect(
      Array.from(el.querySelectorAll('fieldset[formarrayname] mat-label')).map((l) => l.textContent?.trim()),
    ).toEqual(['M', 'L']);
    el.querySelector<HTMLButtonElement>('button[type=submit]')!.click();
    const req = TestBed.inject(HttpTestingController).expectOne('/api/admin/runs');
    // Winnipeg keeps CST (-06:00) until the second Sunday of March and CDT (-05:00) after (IANA tz database, from memory).
    expect(req.request.body).toEqual({
      productId: 7,
      cap: 40,
      opensAt: '2027-03-01T09:00:00-06:00',
      closesAt: '2027-03-21T21:30:00-05:00',
      unitCostCents: 875,
      variantCaps: [{ variantId: 72, cap: 12 }],
    });
  });

  it('should show the server’s message beside the field it names', async () => {
    const fixture = await filled();
    const el: HTMLElement = fixture.nativeElement;
    el.querySelector<HTMLButtonElement>('button[type=submit]')!.click();
    TestBed.inject(HttpTestingController)
      .expectOne('/api/admin/runs')
      .flush(
        {
          error: {
            code: 'bad_request',
            message: 'The new run must open after the last one opened.',
            fields: { opensAt: 'Must be after the last run opened.', unitCostCents: 'Too much.' },
          },
        },
        { status: 400, statusText: 'Bad Request' },
      );
    await fixture.whenStable();
    const errors = Array.from(el.querySelectorAll('mat-error')).map((e) => e.textContent?.trim());
    expect(errors).toEqual(expect.arrayContaining(['Must be after the last run opened.', 'Too much.']));
    expect(el.querySelector('[role=alert]')?.textContent).toContain('must open after the last one opened');
  });
});
