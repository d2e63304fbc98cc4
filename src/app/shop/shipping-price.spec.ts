import { shippingPrice } from './shipping-price';

describe('shippingPrice', () => {
  const brackets = [{ maxGrams: null, priceCents: 2400 }, { maxGrams: 500, priceCents: 900 }, { maxGrams: 1000, priceCents: 1400 }];

  it('takes the first bracket the parcel fits, whatever order they are listed in', () => {
    expect(shippingPrice(190, brackets)).toBe(900);
    expect(shippingPrice(500, brackets)).toBe(900);
    expect(shippingPrice(501, brackets)).toBe(1400);
    expect(shippingPrice(5000, brackets)).toBe(2400);
  });

  it('is null when the parcel is heavier than every bracket', () => {
    expect(shippingPrice(1200, [{ maxGrams: 1000, priceCents: 1400 }])).toBeNull();
  });
});
