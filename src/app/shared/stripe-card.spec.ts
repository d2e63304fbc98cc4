import { TestBed } from '@angular/core/testing';
import { STRIPE_JS, StripeCard } from './stripe-card';

type Handler = (e: { complete: boolean; error?: { message: string } }) => void;

/** Just enough of Stripe.js to drive the component: one card element and a token call. */
function fakeStripe(tokenAnswer: object) {
  const handlers: Record<string, Handler> = {};
  const element = {
    mounted: null as HTMLElement | null,
    on: (name: string, h: Handler) => (handlers[name] = h),
    mount(el: HTMLElement) {
      this.mounted = el;
      handlers['ready']?.({ complete: false });
    },
    destroy: jest.fn(),
  };
  const stripe = {
    elements: () => ({ create: jest.fn(() => element) }),
    createToken: jest.fn(async () => tokenAnswer),
  };
  return { stripe, element, fire: (e: Parameters<Handler>[0]) => handlers['change'](e) };
}

describe('StripeCard', () => {
  async function render(fake: ReturnType<typeof fakeStripe> | null) {
    const load = jest.fn(async () => fake?.stripe ?? null);
    TestBed.configureTestingModule({ imports: [StripeCard], providers: [{ provide: STRIPE_JS, useValue: load }] });
    const fixture = TestBed.createComponent(StripeCard);
    fixture.componentRef.setInput('publishableKey', 'pk_test_padside');
    const complete: boolean[] = [];
    fixture.componentInstance.completeChange.subscribe((c) => complete.push(c));
    fixture.detectChanges();
    await fixture.whenStable();
    await new Promise((r) => setTimeout(r));
    fixture.detectChanges();
    return { fixture, load, complete, el: fixture.nativeElement as HTMLElement };
  }

  it('should load Stripe.js with the key, mount the card frame and pass its token on', async () => {
    const fake = fakeStripe({ token: { id: 'tok_from_frame' } });
    const { fixture, load, complete, el } = await render(fake);
    expect(load).toHaveBeenCalledWith('pk_test_padside');
    expect(fake.element.mounted).toBe(el.querySelector('.card-field'));
    expect(el.textContent).not.toContain('Loading secure card entry');
    fake.fire({ complete: true });
    expect(complete).toEqual([true]);
    await expect(fixture.componentInstance.token()).resolves.toBe('tok_from_frame');
    expect(fake.stripe.createToken).toHaveBeenCalledWith(fake.element);
  });

  it('should show the processor’s words beside the card and refuse to give a token', async () => {
    const fake = fakeStripe({ error: { message: 'Your card number is incomplete.' } });
    const { fixture, el } = await render(fake);
    fake.fire({ complete: false, error: { message: 'Your card’s expiry year is in the past.' } });
    fixture.detectChanges();
    expect(el.querySelector('[role=alert]')?.textContent).toContain('expiry year is in the past');
    await expect(fixture.componentInstance.token()).rejects.toThrow('Your card number is incomplete.');
  });

  it('should say so when Stripe.js cannot load', async () => {
    const { fixture, el } = await render(null);
    expect(el.querySelector('[role=alert]')?.textContent).toContain('could not load');
    await expect(fixture.componentInstance.token()).rejects.toThrow('not loaded');
  });
});
