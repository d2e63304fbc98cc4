import { ChangeDetectionStrategy, Component, computed, inject, signal, viewChild } from '@angular/core';
import { HttpErrorResponse } from '@angular/common/http';
import { rxResource, takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { Router, RouterLink } from '@angular/router';
import { StepperSelectionEvent } from '@angular/cdk/stepper';
import { debounceTime, firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { MatStepper, MatStepperModule } from '@angular/material/stepper';
import { apiErrorMessage, applyServerErrors } from '../core/api-error';
import { SessionStore } from '../core/session-store';
import { FieldErrorPipe } from '../shared/field-error-pipe';
import { MoneyPipe } from '../shared/money-pipe';
import { CartStore } from './cart-store';
import { ShopApi } from './shop-api';
import { CardEntryApi } from '../shared/card-entry';
import { StripeCard } from '../shared/stripe-card';
import { TEST_CARDS } from '../shared/test-cards';
import type { Quote } from '@contracts/shop/shop-answers';
import type { QuoteInput } from '@contracts/shop/shop-schemas';
import { normalisePostalCode } from '@contracts/shop/postal-code';
import { shippingFor } from '@contracts/shop/shipping-price';
import { SiteNames } from '../core/site-names';

const formatCents = (cents: number) =>
  new Intl.NumberFormat('en-CA', { style: 'currency', currency: 'CAD' }).format(cents / 100);

const PROVINCES = [
  ['AB', 'Alberta'],
  ['BC', 'British Columbia'],
  ['MB', 'Manitoba'],
  ['NB', 'New Brunswick'],
  ['NL', 'Newfoundland and Labrador'],
  ['NS', 'Nova Scotia'],
  ['NT', 'Northwest Territories'],
  ['NU', 'Nunavut'],
  ['ON', 'Ontario'],
  ['PE', 'Prince Edward Island'],
  ['QC', 'Quebec'],
  ['SK', 'Saskatchewan'],
  ['YT', 'Yukon'],
] as const;
const COUNTRIES = [
  ['CA', 'Canada'],
  ['US', 'United States'],
  ['AU', 'Australia'],
  ['DE', 'Germany'],
  ['FR', 'France'],
  ['GB', 'United Kingdom'],
  ['JP', 'Japan'],
  ['MX', 'Mexico'],
  ['NZ', 'New Zealand'],
] as const;

/** Checkout in four steps (contact, shipping, payment, review); every figure shown comes from the server's quote. */
@Component({
  selector: 'ps-checkout',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatRadioModule,
    MatSelectModule,
    MatStepperModule,
    FieldErrorPipe,
    MoneyPipe,
    StripeCard,
  ],
  templateUrl: './checkout.html',
  styleUrl: './checkout.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Checkout {
  private readonly api = inject(ShopApi);
  private readonly cardEntryApi = inject(CardEntryApi);
  private readonly router = inject(Router);
  protected readonly cart = inject(CartStore);
  private readonly session = inject(SessionStore);
  protected readonly site = inject(SiteNames);
  private readonly fb = inject(NonNullableFormBuilder);

  protected readonly provinces = PROVINCES;
  protected readonly countries = COUNTRIES;
  protected readonly cards = TEST_CARDS;
  protected readonly methods = rxResource({ stream: () => this.api.shippingMethods() });

  protected readonly contact = this.fb.group({
    email: [this.session.user()?.email ?? '', [Validators.required, Validators.email]],
  });
  protected readonly shipping = this.fb.group({
    shippingMethodId: [0, [Validators.required, Validators.min(1)]],
    shipTo: this.fb.group({
      name: [this.session.user()?.displayName ?? '', Validators.required],
      line1: [''],
      line2: [''],
      city: [''],
      province: ['MB'],
      postalCode: [''],
      country: ['CA', Validators.required],
    }),
  });
  protected readonly payment = this.fb.group({ paymentToken: ['tok_visa', Validators.required] });
  /** With Stripe.js the payment step is done once its card frame reports a complete card. */
  protected readonly cardForm = this.fb.group({ complete: [false, Validators.requiredTrue] });
  protected readonly cardEntry = rxResource({ stream: () => this.cardEntryApi.cardEntry() });
  protected readonly usesStripeJs = computed(() => this.cardEntry.value()?.mode === 'stripe-js');
  private readonly stripeCard = viewChild(StripeCard);
  private readonly stepper = viewChild(MatStepper);
  /** Why the chosen card was refused; shown beside the card choice and cleared when the buyer changes it. */
  protected readonly cardProblem = signal<string | null>(null);

  private readonly methodId = toSignal(this.shipping.controls.shippingMethodId.valueChanges, { initialValue: 0 });
  private readonly country = toSignal(this.shipping.controls.shipTo.controls.country.valueChanges, {
    initialValue: 'CA',
  });
  protected readonly isPickup = computed(
    () => this.methods.value()?.find((m) => m.id === this.methodId())?.code === 'pickup',
  );
  protected readonly inCanada = computed(() => this.country() === 'CA');

  /** Each method with its price for this cart (a guide; the quote is what is charged). */
  protected readonly pricedMethods = computed(() => {
    const grams = this.cart.weightGrams();
    return (this.methods.value() ?? []).map((m) => {
      const prices = m.brackets.map((b) => b.priceCents);
      const cents = grams === null ? null : shippingFor(grams, m.brackets);
      return {
        ...m,
        priceText:
          cents === 0
            ? 'free'
            : cents !== null
              ? formatCents(cents)
              : grams === null && prices.length
                ? `from ${formatCents(Math.min(...prices))}`
                : 'too heavy for this method',
      };
    });
  });
  /** The address of the signed-in buyer's latest mailed order, offered again. */
  protected readonly lastShipTo = rxResource({
    params: () => (this.session.signedIn() ? true : undefined),
    stream: () => this.api.lastShipTo(),
  });
  protected readonly lastAddress = computed(() => (this.lastShipTo.hasValue() ? this.lastShipTo.value() : null));
  private readonly shipToValue = toSignal(this.shipping.controls.shipTo.valueChanges, {
    initialValue: this.shipping.controls.shipTo.getRawValue(),
  });
  /** The address as the review step shows it, line by line. */
  protected readonly addressLines = computed(() => {
    const s = this.shipToValue();
    const country = COUNTRIES.find((c) => c[0] === s.country)?.[1] ?? s.country;
    return [s.name, s.line1, s.line2, [s.city, s.province, s.postalCode].filter(Boolean).join(' '), country].filter(
      (x) => !!x && x.trim(),
    );
  });
  protected readonly quote = signal<Quote | null>(null);
  protected readonly problem = signal<string | null>(null);
  protected readonly pending = signal<{ id: number; message: string } | null>(null);
  protected readonly busy = signal(false);

  constructor() {
    this.payment.controls.paymentToken.valueChanges
      .pipe(takeUntilDestroyed())
      .subscribe(() => this.cardProblem.set(null));
    // The summary follows the shipping form as the buyer types; field messages wait until they move on.
    this.shipping.valueChanges.pipe(debounceTime(400), takeUntilDestroyed()).subscribe(() => {
      if (this.shipping.controls.shippingMethodId.value > 0) void this.refreshQuote();
    });
  }

  /** Shows the postal code as it will be stored, once the buyer leaves the field. */
  protected tidyPostalCode(): void {
    const to = this.shipping.controls.shipTo.controls;
    const tidy = normalisePostalCode(to.country.value, to.postalCode.value);
    if (tidy !== to.postalCode.value) to.postalCode.setValue(tidy);
  }

  /** Fills the address with the one from the buyer's latest mailed order. */
  protected useLastAddress(): void {
    const last = this.lastAddress();
    if (last) this.shipping.controls.shipTo.patchValue(last);
  }

  private request(): QuoteInput {
    const s = this.shipping.getRawValue();
    return {
      items: this.cart.lines().map((l) => ({ variantId: l.variantId, quantity: l.quantity })),
      shipTo: s.shipTo,
      shippingMethodId: s.shippingMethodId,
    };
  }

  /** Re-quotes when the buyer leaves the shipping step, so payment and review show the server's totals. */
  protected async stepChanged(e: StepperSelectionEvent): Promise<void> {
    if (e.previouslySelectedIndex === 1 && e.selectedIndex > 1) await this.checkQuote();
  }

  /** Re-quotes while the buyer types: a refusal only empties the summary, so no message interrupts them. */
  protected refreshQuote(): Promise<void> {
    return this.fetchQuote();
  }

  /** Re-quotes and puts a refusal's messages on the shipping fields they name. */
  protected checkQuote(): Promise<void> {
    return this.fetchQuote((err) => this.problem.set(applyServerErrors(this.shipping, err)));
  }

  private async fetchQuote(onRefused?: (err: unknown) => void): Promise<void> {
    try {
      this.quote.set(await firstValueFrom(this.api.quote(this.request())));
      this.problem.set(null);
    } catch (err) {
      this.quote.set(null);
      onRefused?.(err);
    }
  }

  /** The Stripe.js frame reports whether its card is complete; typing a new card clears a refusal. */
  protected cardComplete(complete: boolean): void {
    this.cardForm.controls.complete.setValue(complete);
    this.cardProblem.set(null);
  }

  protected async placeOrder(): Promise<void> {
    if (this.busy() || !this.quote()) return;
    this.busy.set(true);
    this.problem.set(null);
    this.cardProblem.set(null);
    try {
      const card = this.stripeCard();
      const token = card ? await card.token() : this.payment.getRawValue().paymentToken;
      const pending = this.pending();
      const res = await firstValueFrom(
        pending
          ? this.api.payAgain(pending.id, token)
          : this.api.placeOrder({ ...this.request(), email: this.contact.getRawValue().email, paymentToken: token }),
      );
      if (res.order.status === 'pending') {
        this.pending.set({ id: res.order.id, message: res.message ?? 'We could not confirm the payment.' });
        return;
      }
      this.cart.clear();
      await this.router.navigate(['/shop/orders', res.order.id], { queryParams: { placed: 1 } });
    } catch (err) {
      if (!(err instanceof HttpErrorResponse)) {
        // Stripe.js could not tokenise the card; it already shows why beside the card field.
        this.problem.set(err instanceof Error ? err.message : 'The card details could not be used.');
        return;
      }
      if (err.status === 402) {
        // A refused card is about the card: back to the card choice, with the reason beside it.
        this.cardProblem.set(apiErrorMessage(err));
        const stepper = this.stepper();
        if (stepper) stepper.selectedIndex = 2;
        return;
      }
      const message = applyServerErrors(this.contact, err);
      applyServerErrors(this.shipping, err);
      applyServerErrors(this.payment, err);
      this.problem.set(message);
    } finally {
      this.busy.set(false);
    }
  }
}
