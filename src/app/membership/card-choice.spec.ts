import { Component, signal, viewChild } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { FormControl, Validators } from '@angular/forms';
import { of } from 'rxjs';
import { CardEntryApi, type CardEntry } from '../shared/card-entry';
import { STRIPE_JS } from '../shared/stripe-card';
import { TEST_CARDS } from '../shared/test-cards';
import { CardChoice, NEW_CARD, savedCardText } from './card-choice';
import type { SavedCard } from '@contracts/membership/membership-answers';

@Component({
  imports: [CardChoice],
  template: `<ps-card-choice [control]="control" [hasSavedCard]="hasSaved()" [savedCard]="saved()" />`,
})
class Host {
  readonly control = new FormControl('', { nonNullable: true, validators: Validators.required });
  readonly hasSaved = signal(false);
  readonly saved = signal<SavedCard | null>(null);
  readonly choice = viewChild.required(CardChoice);
}

/** Just enough of Stripe.js: a card element whose change handler the test fires, and a token call. */
function fakeStripe() {
  const handlers: Record<string, (e: { complete: boolean }) => void> = {};
  const element = {
    on: (name: string, h: (e: { complete: boolean }) => void) => (handlers[name] = h),
    mount: () => handlers['ready']?.({ complete: false }),
    destroy: () => undefined,
  };
  return {
    stripe: {
      elements: () => ({ create: () => element }),
      createToken: jest.fn(async () => ({ token: { id: 'tok_from_frame' } })),
    },
    fire: (complete: boolean) => handlers['change']({ complete }),
  };
}

async function render(entry: CardEntry, fake = fakeStripe()) {
  TestBed.configureTestingModule({
    imports: [Host],
    providers: [
      { provide: CardEntryApi, useValue: { cardEntry: () => of(entry) } },
      { provide: STRIPE_JS, useValue: async () => fake.stripe },
    ],
  });
  const fixture = TestBed.createComponent(Host);
  fixture.detectChanges();
  await fixture.whenStable();
  await new Promise((r) => setTimeout(r));
  fixture.detectChanges();
  return { fixture, host: fixture.componentInstance, el: fixture.nativeElement as HTMLElement, fake };
}

describe('CardChoice', () => {
  it('should offer the shared test cards without a publishable key and pass the chosen token on', async () => {
    const { host, el } = await render({ mode: 'test-cards', publishableKey: null });
    expect(el.querySelector('mat-select')).not.toBeNull();
    expect(el.querySelector('.card-field')).toBeNull();
    host.control.setValue(TEST_CARDS[0].token);
    await expect(host.choice().token()).resolves.toBe('tok_visa');
    host.control.setValue('');
    await expect(host.choice().token()).resolves.toBeUndefined();
  });

  it('should show the processor’s frame with a key, and count the card as chosen only once it is complete', async () => {
    const { fixture, host, el, fake } = await render({ mode: 'stripe-js', publishableKey: 'pk_test_padside' });
    expect(el.querySelector('mat-select')).toBeNull();
    expect(el.querySelector('.card-field')).not.toBeNull();
    fake.fire(false);
    fixture.detectChanges();
    expect(host.control.invalid).toBe(true);
    expect(el.querySelector('[role=alert]')?.textContent).toContain('Card is required.');
    fake.fire(true);
    fixture.detectChanges();
    expect(host.control.value).toBe(NEW_CARD);
    await expect(host.choice().token()).resolves.toBe('tok_from_frame');
  });

  it('should name the card on file by brand and last four', () => {
    expect(savedCardText({ brand: 'Visa', last4: '4242' })).toBe('Visa ending 4242');
    expect(savedCardText(null)).toBe('The card on file');
  });
});
