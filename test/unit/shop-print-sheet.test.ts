import { printQuantities, roundUpTo } from '../../server/shop/print-sheet';
import { shippingFor } from '../../contracts/shop/shipping-price';
import { percentOf, shareProportionally } from '../../server/shop/pricing';

// Spares, packs and minimums are the printer's business rules (common practice, no source); the arithmetic is checked by hand.
const v = (label: string, paid: number) => ({ variantId: paid + label.length, label, sku: `TF-${label}`, paid });

describe('printQuantities', () => {
  it('adds 5% spares rounded up, then rounds up to packs of 6', () => {
    const s = printQuantities([v('M', 40), v('L', 7)], { sparesPercent: 5, packMultiple: 6, minimumPerDesign: 12 });
    // M: 40 + ceil(2.0) = 42 -> 42; L: 7 + ceil(0.35) = 8 -> 12.
    expect(s.lines.map((l) => [l.spares, l.toPrint])).toEqual([
      [2, 42],
      [1, 12],
    ]);
    expect(s.totalToPrint).toBe(54);
    expect(s.totalPaid).toBe(47);
  });
  it('raises a small design to the printer minimum on the best seller, in whole packs', () => {
    const s = printQuantities([v('S', 2), v('M', 3), v('XL', 0)], {
      sparesPercent: 5,
      packMultiple: 4,
      minimumPerDesign: 24,
    });
    // S: 2+1=3 -> 4; M: 3+1=4 -> 4; XL: 0. Total 8 < 24: shortfall 16 -> M gets 20.
    expect(s.lines.map((l) => l.toPrint)).toEqual([4, 20, 0]);
    expect(s.totalToPrint).toBe(24);
  });
  it('prints nothing when nothing is paid', () => {
    expect(printQuantities([v('M', 0)], { sparesPercent: 5, packMultiple: 6, minimumPerDesign: 12 }).totalToPrint).toBe(
      0,
    );
  });
  it('rounds up to a multiple', () => {
    expect([roundUpTo(1, 12), roundUpTo(12, 12), roundUpTo(13, 12)]).toEqual([12, 12, 24]);
  });
});

describe('pricing helpers', () => {
  it('picks the first weight bracket that holds the parcel', () => {
    const b = [
      { maxGrams: 1500, priceCents: 1400 },
      { maxGrams: 500, priceCents: 900 },
    ];
    expect([shippingFor(200, b), shippingFor(500, b), shippingFor(501, b), shippingFor(1501, b)]).toEqual([
      900,
      900,
      1400,
      null,
    ]);
    expect(shippingFor(99999, [{ maxGrams: null, priceCents: 0 }])).toBe(0);
  });
  it('takes a member discount of 10% half-up', () => {
    expect([percentOf(3500, 10), percentOf(3505, 10), percentOf(3504, 10)]).toEqual([350, 351, 350]);
  });
  it('shares an amount so the parts add up exactly', () => {
    const parts = shareProportionally(1000, [1, 1, 1]);
    expect(parts.reduce((s, p) => s + p, 0)).toBe(1000);
    expect(parts.sort()).toEqual([333, 333, 334]);
  });
});
