import { estimateFeeCents, PROCESSOR_FEES } from '../../server/books/processor-fees';
import { FeePercentBody } from '../../contracts/books/books-schemas';
import { fromFeePercent, toFeePercent } from '../../server/books/fee-percent';

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

describe('the fee estimate typed as a percentage', () => {
  // 1 % is 100 basis points (the definition of a basis point, common practice, no source).
  it('reads 290 and 80 basis points as 2.9 % and 0.8 % and writes them back unchanged', () => {
    const form = toFeePercent(PROCESSOR_FEES.defaults);
    expect(form).toEqual({ percent: 2.9, fixedCents: 30, internationalExtraPercent: 0.8 });
    expect(fromFeePercent(form)).toEqual(PROCESSOR_FEES.defaults);
  });

  it('stores 1.15 % as 115 basis points despite binary fractions', () => {
    // 1.15 * 100 is 114.99999999999999 in IEEE 754 doubles (seen in Node 20).
    expect(
      fromFeePercent(FeePercentBody.parse({ percent: 2.95, fixedCents: 0, internationalExtraPercent: 1.15 })),
    ).toEqual({ percentBasisPoints: 295, fixedCents: 0, internationalExtraBasisPoints: 115 });
  });

  it('refuses more than two decimals, a negative or more than 100 %', () => {
    expect(FeePercentBody.safeParse({ percent: 2.905, fixedCents: 30, internationalExtraPercent: 0 }).success).toBe(
      false,
    );
    expect(FeePercentBody.safeParse({ percent: -0.1, fixedCents: 30, internationalExtraPercent: 0 }).success).toBe(
      false,
    );
    expect(FeePercentBody.safeParse({ percent: 100.01, fixedCents: 30, internationalExtraPercent: 0 }).success).toBe(
      false,
    );
  });
});
