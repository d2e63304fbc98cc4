import {
  afterNextRender,
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  ElementRef,
  inject,
  InjectionToken,
  input,
  output,
  signal,
  viewChild,
} from '@angular/core';
import type { Stripe, StripeCardElement } from '@stripe/stripe-js';

/** Loads Stripe.js for a publishable key; the pure entry point so nothing is fetched until the payment step asks. */
export const STRIPE_JS = new InjectionToken<(publishableKey: string) => Promise<Stripe | null>>('Stripe.js loader', {
  providedIn: 'root',
  factory: () => async (publishableKey) => (await import('@stripe/stripe-js/pure')).loadStripe(publishableKey),
});

/**
 * Card entry in the processor's own frame: the number, expiry and CVC are typed into Stripe.js and never reach
 * Padside; the parent asks for a single-use token when the buyer places the order.
 */
@Component({
  selector: 'ps-stripe-card',
  template: `
    <div class="card-field" #mount role="group" aria-label="Card details"></div>
    @if (problem(); as p) {
      <p class="field-problem" role="alert">{{ p }}</p>
    } @else if (!ready()) {
      <p class="form-note" role="status">Loading secure card entry…</p>
    }
  `,
  styles: `
    .field-problem {
      color: var(--mat-sys-error);
      margin: 4px 0;
    }
    .card-field {
      padding: 14px 12px;
      border: 1px solid var(--mat-sys-outline);
      border-radius: 8px;
      background: var(--mat-sys-surface);
      max-width: 460px;
    }
    .card-field:focus-within {
      outline: 2px solid var(--ps-igniter);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StripeCard {
  readonly publishableKey = input.required<string>();
  /** True once the buyer has typed a complete, plausible card. */
  readonly completeChange = output<boolean>();

  private readonly load = inject(STRIPE_JS);
  private readonly mount = viewChild.required<ElementRef<HTMLElement>>('mount');
  protected readonly ready = signal(false);
  protected readonly problem = signal<string | null>(null);
  private stripe: Stripe | null = null;
  private card: StripeCardElement | null = null;

  constructor() {
    afterNextRender(() => void this.start());
    inject(DestroyRef).onDestroy(() => this.card?.destroy());
  }

  private async start(): Promise<void> {
    this.stripe = await this.load(this.publishableKey()).catch(() => null);
    if (!this.stripe) {
      this.problem.set('Card entry could not load. Check your connection and reload the page.');
      return;
    }
    this.card = this.stripe
      .elements({ locale: 'en' })
      .create('card', { style: { base: { fontFamily: 'Montserrat, sans-serif', fontSize: '16px' } } });
    this.card.on('ready', () => this.ready.set(true));
    this.card.on('change', (e) => {
      this.problem.set(e.error?.message ?? null);
      this.completeChange.emit(e.complete);
    });
    this.card.mount(this.mount().nativeElement);
  }

  /** A single-use token for the card typed in; rejects with the processor's words if it cannot make one. */
  async token(): Promise<string> {
    if (!this.stripe || !this.card) throw new Error('Card entry has not loaded yet.');
    const result = await this.stripe.createToken(this.card);
    if (result.error) {
      const message = result.error.message ?? 'The card details could not be used.';
      this.problem.set(message);
      throw new Error(message);
    }
    return result.token.id;
  }
}
