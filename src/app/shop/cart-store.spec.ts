import { TestBed } from '@angular/core/testing';
import { CartStore } from './cart-store';

describe('CartStore', () => {
  beforeEach(() => localStorage.clear());

  it('merges the same variant, caps at 20 and drops a line set to zero', () => {
    const cart = TestBed.inject(CartStore);
    const line = {
      variantId: 7,
      quantity: 15,
      productName: 'Shirt',
      variantLabel: 'M',
      slug: 'shirt',
      priceCents: 3200,
    };
    cart.add(line);
    cart.add(line);
    expect(cart.lines()).toHaveLength(1);
    expect(cart.count()).toBe(20);
    expect(cart.guideTotalCents()).toBe(64000);
    cart.setQuantity(7, 0);
    expect(cart.count()).toBe(0);
  });

  it('saves to localStorage and reads it back', () => {
    const cart = TestBed.inject(CartStore);
    cart.add({ variantId: 3, quantity: 2, productName: 'Pin', variantLabel: 'Gold', slug: 'pin', priceCents: 1200 });
    TestBed.tick();
    expect(JSON.parse(localStorage.getItem('padside.cart.v1')!)).toEqual([
      expect.objectContaining({ variantId: 3, quantity: 2 }),
    ]);
  });
});
