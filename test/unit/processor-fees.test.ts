import { estimateFeeCents, PROCESSOR_FEES } from '../../server/books/processor-fees';

describe('estimateFeeCents', () => {
  const s = PROCESSOR_FEES.defaults;

  // Stripe Canadian pricing, 2.9% + C$0.30 domestic (secondary copy) and +0.8% international card (Stripe Support,
  // October 2023 pricing update): C$100 -> C$3.20 domestic, C$4.00 international.
  it('should match the published worked example for C$100', () => {
    expect(estimateFeeCents(10000, false, s)).toBe(320);
    expect(estimateFeeCents(10000, true, s)).toBe(400);
  });

  it('should round the percentage half-up to the cent', () => {
    // 2.9% of C$0.50 is 1.45 cents -> 1 cent; of C$1.50 is 4.35 -> 4; of C$2.50 is 7.25 -> 7; of C$5.00 is 14.5 -> 15.
    expect(estimateFeeCents(50, false, s)).toBe(31);
    expect(estimateFeeCents(500, false, s)).toBe(45);
  });
});
