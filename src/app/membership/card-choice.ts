import {
  ChangeDetectionStrategy,
  ChangeDetectorRef,
  Component,
  computed,
  effect,
  inject,
  input,
  signal,
  viewChild,
} from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { CardEntryApi } from '../shared/card-entry';
import { FieldErrorPipe } from '../shared/field-error-pipe';
import { StripeCard } from '../shared/stripe-card';
import { TEST_CARDS } from '../shared/test-cards';
import type { SavedCard } from '@contracts/membership/membership-answers';

/** The control value for "the card typed into the processor's frame"; swapped for a token when paying. */
export const NEW_CARD = 'new-card';

/** "Visa ending 4242", or a plain phrase for a card saved before brands were kept. */
export function savedCardText(card: SavedCard | null): string {
  return card ? `${card.brand} ending ${card.last4}` : 'The card on file';
}

/**
 * The card field of the dues forms. The control holds '' for the card on file, a test token from the shared list
 * while Padside talks to the local fake, or NEW_CARD for a card typed into the processor's frame (Stripe.js, when a
 * publishable key is set); `token()` turns that into what the API takes.
 */
@Component({
  selector: 'ps-card-choice',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatSelectModule, FieldErrorPipe, StripeCard],
  template: `
    @if (entry.value(); as e) {
      @if (e.mode === 'test-cards' || hasSavedCard()) {
        <mat-form-field class="ps-full-width" subscriptSizing="dynamic">
          <mat-label>{{ label() }}</mat-label>
          <mat-select [formControl]="control()">
            @if (hasSavedCard()) {
              <mat-option value="">{{ savedText() }} (on file)</mat-option>
            }
            @if (e.mode === 'stripe-js') {
              <mat-option [value]="newCard">A new card</mat-option>
            } @else {
              @for (c of cards; track c.token) {
                <mat-option [value]="c.token">{{ c.label }}</mat-option>
              }
            }
          </mat-select>
          @if (e.mode === 'test-cards') {
            <mat-hint>Test mode: pick one of the payment processor's test cards. No real card is charged.</mat-hint>
          }
          <mat-error>{{ control() | fieldError: 'Card' }}</mat-error>
        </mat-form-field>
      }
      @if (e.mode === 'stripe-js' && (!hasSavedCard() || chosen() === newCard)) {
        <p class="form-note">
          Type the card below. It goes straight to the card processor in its own secure frame; card numbers never reach
          Padside.
        </p>
        <ps-stripe-card [publishableKey]="e.publishableKey" (completeChange)="frameComplete($event)" />
        @if (!hasSavedCard() && control().touched && control().invalid) {
          <p class="field-problem" role="alert">{{ control() | fieldError: 'Card' }}</p>
        }
      }
    } @else if (entry.error()) {
      <p class="form-problem" role="alert">Payment options could not load. Reload the page to try again.</p>
    }
  `,
  styles: `
    .field-problem {
      color: var(--mat-sys-error);
      margin: 4px 0;
    }
    ps-stripe-card {
      display: block;
      margin-bottom: 16px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CardChoice {
  readonly control = input.required<FormControl<string>>();
  readonly label = input('Card');
  readonly hasSavedCard = input(false);
  readonly savedCard = input<SavedCard | null>(null);

  private readonly cardEntryApi = inject(CardEntryApi);
  protected readonly entry = rxResource({ stream: () => this.cardEntryApi.cardEntry() });
  protected readonly cards = TEST_CARDS;
  protected readonly newCard = NEW_CARD;
  protected readonly savedText = computed(() => savedCardText(this.savedCard()));
  protected readonly chosen = signal('');
  private readonly frame = viewChild(StripeCard);

  constructor() {
    // The frame shows while "a new card" is chosen (a reset of the form puts the choice back too); the message
    // beside the frame follows the control's touched state and errors, which are not signals.
    const cdr = inject(ChangeDetectorRef);
    effect((onCleanup) => {
      const control = this.control();
      this.chosen.set(control.value);
      const sub = control.events.subscribe(() => {
        this.chosen.set(control.value);
        cdr.markForCheck();
      });
      onCleanup(() => sub.unsubscribe());
    });
  }

  /** Without a card on file the frame is the only choice: the control says whether it holds a complete card. */
  protected frameComplete(complete: boolean): void {
    if (this.hasSavedCard()) return;
    this.control().setValue(complete ? NEW_CARD : '');
    this.control().markAsTouched();
  }

  /** What to send as `paymentToken`: a token, or undefined for the card on file. */
  async token(): Promise<string | undefined> {
    const value = this.control().value;
    if (value !== NEW_CARD) return value || undefined;
    const frame = this.frame();
    if (!frame) throw new Error('Card entry has not loaded yet.');
    return frame.token();
  }
}
