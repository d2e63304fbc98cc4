import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { RefundPanel } from './refund-panel';
import type { RefundPreview, StaffOrder, StaffRefund } from '@contracts/shop/staff-order-answers';

const order = (over: Partial<StaffOrder> = {}): StaffOrder => ({
  id: 41,
  number: 'PS-000041',
  status: 'paid',
  email: 'odalys@example.test',
  createdAt: '2026-11-02T17:00:00Z',
  paidAt: '2026-11-02T17:00:00Z',
  packedAt: null,
  shippedAt: null,
  shipTo: {
    name: 'Odalys Test',
    line1: '3 Sod House Lane',
    line2: '',
    city: 'Gopher Flats',
    province: 'MB',
    postalCode: 'R0K 1A0',
    country: 'CA',
  },
  shippingMethod: { code: 'canada', name: 'Mail within Canada' },
  carrier: null,
  trackingNumber: null,
  items: [
    {
      id: 501,
      variantId: 71,
      runId: null,
      productName: 'Season shirt',
      variantLabel: 'M',
      sku: 'T-M',
      unitPriceCents: 3500,
      quantity: 2,
      lineCents: 7000,
      restockedQuantity: 0,
      refundedQuantity: 0,
      unitsToPack: 2,
    },
    {
      id: 502,
      variantId: 72,
      runId: null,
      productName: 'Season shirt',
      variantLabel: 'L',
      sku: 'T-L',
      unitPriceCents: 3500,
      quantity: 1,
      lineCents: 3500,
      restockedQuantity: 0,
      refundedQuantity: 0,
      unitsToPack: 1,
    },
  ],
  discountPercent: 0,
  subtotalCents: 10500,
  discountCents: 0,
  shippingCents: 1400,
  taxLines: [],
  taxCents: 1428,
  totalCents: 13328,
  refundedCents: 0,
  currency: 'CAD',
  paymentMessage: null,
  weightGrams: 620,
  pricedOn: '2026-11-02',
  chargeId: 'ch_test',
  paidOutsideProcessor: false,
  paymentAttempts: 1,
  disputedAt: null,
  disputeReason: null,
  awaitingPrint: [],
  shippingRefundedCents: 0,
  refunds: [],
  ...over,
});

// One M shirt: 35.00 + GST 5% 1.75 + RST 7% 2.45 (the server's arithmetic; here only shown).
const preview: RefundPreview = {
  lines: [{ orderItemId: 501, quantity: 1, goodsCents: 3500 }],
  goodsCents: 3500,
  shippingCents: 0,
  taxLines: [
    { code: 'GST', jurisdiction: 'MB', label: 'GST 5%', ratePercent: '5', taxableCents: 3500, taxCents: 175 },
    { code: 'RST', jurisdiction: 'MB', label: 'RST 7%', ratePercent: '7', taxableCents: 3500, taxCents: 245 },
  ],
  taxCents: 420,
  totalCents: 3920,
  closesOrder: false,
};

describe('RefundPanel', () => {
  let fixture: ComponentFixture<RefundPanel>;
  let http: HttpTestingController;
  let el: HTMLElement;
  let emitted: StaffRefund[];

  const settle = async () => {
    await new Promise((resolve) => setTimeout(resolve));
    fixture.detectChanges();
    await fixture.whenStable();
  };
  const tick = async (n: number) => {
    el.querySelectorAll<HTMLInputElement>('fieldset mat-checkbox input[type=checkbox]')[n].click();
    await settle();
  };
  const checkbox = (text: RegExp) =>
    Array.from(el.querySelectorAll('mat-checkbox'))
      .find((c) => text.test(c.textContent ?? ''))!
      .querySelector('input')!;
  const submit = async () => {
    el.querySelector<HTMLButtonElement>('button[type=submit]')!.click();
    await settle();
  };
  /** The dialog answers after its closing animation; wait for the request it leads to (or its absence). */
  const afterDialog = async () => {
    for (let i = 0; i < 200 && document.querySelector('mat-dialog-container'); i++) {
      await new Promise((resolve) => setTimeout(resolve, 10));
      await settle();
    }
    await settle();
  };
  const dialogButton = (text: RegExp) =>
    Array.from(document.querySelectorAll<HTMLButtonElement>('mat-dialog-actions button')).find((b) =>
      text.test(b.textContent ?? ''),
    )!;

  beforeEach(async () => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(RefundPanel);
    fixture.componentRef.setInput('order', order());
    emitted = [];
    fixture.componentInstance.refunded.subscribe((r) => emitted.push(r));
    await settle();
    el = fixture.nativeElement as HTMLElement;
  });
  afterEach(() => {
    http.verify();
    document.querySelectorAll('.cdk-overlay-container').forEach((c) => (c.innerHTML = ''));
  });

  it('should preview the ticked line, show its tax lines and the units going back on sale, and refund only after the confirmation', async () => {
    await tick(0);
    const units = el.querySelector<HTMLInputElement>('input[formcontrolname=quantity]')!;
    units.value = '1';
    units.dispatchEvent(new Event('input'));
    checkbox(/back on sale/).click();
    await submit();
    const ask = http.expectOne('/api/admin/orders/41/refund-preview');
    expect(ask.request.body).toEqual({ lines: [{ orderItemId: 501, quantity: 1 }], shipping: false, restock: true });
    ask.flush({ refund: preview });
    await settle();
    const dialog = document.querySelector('mat-dialog-container')!;
    expect(dialog.textContent).toContain('GST 5% on $35.00');
    expect(dialog.textContent).toContain('$2.45');
    expect(dialog.textContent).toContain('1 unit goes back on sale');
    http.expectNone('/api/admin/orders/41/refund');
    dialogButton(/Refund \$39\.20/).click();
    await afterDialog();
    const sent = http.expectOne('/api/admin/orders/41/refund');
    expect(sent.request.body).toEqual({
      lines: [{ orderItemId: 501, quantity: 1 }],
      shipping: false,
      restock: true,
      amountCents: 3920,
    });
    expect(sent.request.headers.get('Idempotency-Key')).toMatch(/^console-/);
    sent.flush({
      order: order({ refundedCents: 3920 }),
      refund: { id: 9, state: 'succeeded', origin: 'staff', amountCents: 3920, unitsBackOnSale: 1 },
    });
    await settle();
    expect(emitted.map((r) => r.id)).toEqual([9]);
  });

  it('should send nothing when the treasurer goes back from the confirmation', async () => {
    await tick(1);
    await submit();
    http
      .expectOne('/api/admin/orders/41/refund-preview')
      .flush({ refund: { ...preview, lines: [{ orderItemId: 502, quantity: 1, goodsCents: 3500 }] } });
    await settle();
    dialogButton(/Go back/).click();
    await afterDialog();
    http.expectNone('/api/admin/orders/41/refund');
    expect(emitted).toEqual([]);
  });

  it('should leave no stale error or tick once the refunded order comes back', async () => {
    await submit();
    expect(el.querySelector('[role=alert]')?.textContent).toMatch(/Tick a line or the shipping, or enter an amount/);
    await tick(0);
    expect(el.querySelector('[role=alert]')?.textContent).toMatch(/Tick a line or the shipping, or enter an amount/);
    fixture.componentRef.setInput(
      'order',
      order({
        refundedCents: 3920,
        items: order().items.map((i) => (i.id === 501 ? { ...i, refundedQuantity: 1, unitsToPack: 1 } : i)),
      }),
    );
    await settle();
    expect(el.querySelector('[role=alert]')).toBeNull();
    expect(el.querySelectorAll('mat-error')).toHaveLength(0);
    expect(el.textContent).toContain('1 of 2 left');
    expect(
      Array.from(el.querySelectorAll<HTMLInputElement>('fieldset mat-checkbox input[type=checkbox]')).map(
        (c) => c.checked,
      ),
    ).toEqual([false, false]);
  });

  it('should show the server’s message beside the units of the line it is about', async () => {
    await tick(1);
    await submit();
    http.expectOne('/api/admin/orders/41/refund-preview').flush(
      {
        error: {
          code: 'over_refund',
          message: 'Part of that refund was already refunded.',
          fields: { 'lines.0.quantity': 'This line is already refunded.' },
        },
      },
      { status: 409, statusText: 'Conflict' },
    );
    await settle();
    expect(el.querySelector('[role=alert]')!.textContent).toContain('Part of that refund was already refunded.');
    expect(el.querySelector('mat-error')!.textContent!.trim()).toBe('This line is already refunded.');
    expect(el.querySelectorAll('.line')[1].querySelector('mat-error')).not.toBeNull();
  });
});
