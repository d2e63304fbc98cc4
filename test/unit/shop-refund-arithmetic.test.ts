import {
  computeRefund,
  remainingOf,
  shareProcessorRefund,
  type RefundableOrder,
  type RefundBreakdown,
  type RefundRefusal,
} from '../../server/shop/refund-arithmetic';
import { divideHalfUp } from '../../server/shop/tax';

// A Manitoba order: two shirts at 35.00 and a pin at 8.00, mailed for 14.00. GST 5% and RST 7% both on goods and
// shipping (rates: CRA GST/HST rate table; Manitoba Finance RST rate, from memory).
// GST 5% of 92.00 = 4.60; RST 7% of 92.00 = 6.44; total 92.00 + 11.04 = 103.04.
function mbOrder(over: Partial<RefundableOrder> = {}): RefundableOrder {
  return {
    discountPercent: 0,
    goodsCents: 7800,
    shippingCents: 1400,
    items: [
      { id: 1, unitPriceCents: 3500, quantity: 2, refundedQuantity: 0 },
      { id: 2, unitPriceCents: 800, quantity: 1, refundedQuantity: 0 },
    ],
    taxes: [
      { code: 'GST', jurisdiction: 'MB', ratePercent: '5', taxableCents: 9200, amountCents: 460, onShipping: true },
      { code: 'RST', jurisdiction: 'MB', ratePercent: '7', taxableCents: 9200, amountCents: 644, onShipping: true },
    ],
    refunded: { goodsCents: 0, shippingCents: 0, taxCents: {} },
    ...over,
  };
}

const ok = (r: RefundBreakdown | RefundRefusal): RefundBreakdown => {
  if ('code' in r) throw new Error(`refused: ${r.message} ${JSON.stringify(r.fields)}`);
  return r;
};
const refused = (r: RefundBreakdown | RefundRefusal): RefundRefusal => {
  if (!('code' in r)) throw new Error(`expected a refusal, got ${JSON.stringify(r)}`);
  return r;
};
const taxes = (r: RefundBreakdown) => r.taxes.map((t) => [t.code, t.taxableCents, t.taxCents]);

/** What a settled refund leaves behind, to chain refunds as the service does. */
function after(o: RefundableOrder, r: RefundBreakdown): RefundableOrder {
  const taxCents = { ...o.refunded.taxCents };
  for (const t of r.taxes)
    taxCents[`${t.code}:${t.jurisdiction}`] = (taxCents[`${t.code}:${t.jurisdiction}`] ?? 0) + t.taxCents;
  return {
    ...o,
    items: o.items.map((i) => ({
      ...i,
      refundedQuantity: i.refundedQuantity + (r.lines.find((l) => l.orderItemId === i.id)?.quantity ?? 0),
    })),
    refunded: {
      goodsCents: o.refunded.goodsCents + r.goodsCents,
      shippingCents: o.refunded.shippingCents + r.shippingCents,
      taxCents,
    },
  };
}

describe('divideHalfUp', () => {
  it('rounds halves up and everything else to the nearest cent (common practice, no source)', () => {
    expect(divideHalfUp(5n, 10n)).toBe(1);
    expect(divideHalfUp(4n, 10n)).toBe(0);
    expect(divideHalfUp(15n, 10n)).toBe(2);
    expect(divideHalfUp(14n, 10n)).toBe(1);
  });
});

describe('computeRefund by line', () => {
  it('reverses one shirt and the tax on it at the order’s rates, not a share of the order’s tax', () => {
    // Excise Tax Act s. 232 (credit notes: the tax adjusted is the tax on the amount credited), from memory.
    // 35.00 x 5% = 1.75; 35.00 x 7% = 2.45; total 39.20. A share of the total would have been 39.20 only by chance.
    const r = ok(computeRefund(mbOrder(), { lines: [{ orderItemId: 1, quantity: 1 }], shipping: false }));
    expect([r.goodsCents, r.shippingCents, r.taxCents, r.totalCents]).toEqual([3500, 0, 420, 3920]);
    expect(taxes(r)).toEqual([
      ['GST', 3500, 175],
      ['RST', 3500, 245],
    ]);
    expect(r.lines).toEqual([{ orderItemId: 1, quantity: 1, goodsCents: 3500 }]);
  });

  it('refunds shipping and the taxes that applied to it', () => {
    // 14.00 x 5% = 0.70; 14.00 x 7% = 0.98 (Excise Tax Act s. 232, from memory).
    const r = ok(computeRefund(mbOrder(), { lines: [], shipping: true }));
    expect([r.goodsCents, r.shippingCents, r.totalCents]).toEqual([0, 1400, 1568]);
    expect(taxes(r)).toEqual([
      ['GST', 1400, 70],
      ['RST', 1400, 98],
    ]);
  });

  it('leaves shipping out of a tax that did not apply to it', () => {
    const o = mbOrder({
      taxes: [
        { code: 'GST', jurisdiction: 'MB', ratePercent: '5', taxableCents: 9200, amountCents: 460, onShipping: true },
        { code: 'RST', jurisdiction: 'MB', ratePercent: '7', taxableCents: 7800, amountCents: 546, onShipping: false },
      ],
    });
    const r = ok(computeRefund(o, { lines: [{ orderItemId: 2, quantity: 1 }], shipping: true }));
    // GST on 8.00 + 14.00 = 22.00 -> 1.10; RST on 8.00 only -> 0.56 (common practice, no source).
    expect(taxes(r)).toEqual([
      ['GST', 2200, 110],
      ['RST', 800, 56],
    ]);
    expect(r.totalCents).toBe(2200 + 110 + 56);
  });

  it('takes the member discount off the refunded line, half-up', () => {
    // 10% of 35.00 = 3.50 off: goods 31.50; GST 5% of 31.50 = 1.575 -> 1.58 half-up (common practice, no source).
    const o = mbOrder({ discountPercent: 10, goodsCents: 7020 });
    const r = ok(computeRefund(o, { lines: [{ orderItemId: 1, quantity: 1 }], shipping: false }));
    expect(r.goodsCents).toBe(3150);
    expect(taxes(r)).toEqual([
      ['GST', 3150, 158],
      ['RST', 3150, 221],
    ]);
  });

  it('reverses exactly the tax charged once every line and the shipping are refunded, across several refunds', () => {
    const o = mbOrder();
    const first = ok(computeRefund(o, { lines: [{ orderItemId: 1, quantity: 1 }], shipping: false }));
    const second = ok(
      computeRefund(after(o, first), {
        lines: [
          { orderItemId: 1, quantity: 1 },
          { orderItemId: 2, quantity: 1 },
        ],
        shipping: true,
      }),
    );
    expect(second.closesOrder).toBe(true);
    expect(first.totalCents + second.totalCents).toBe(10304);
    expect(first.taxes[0].taxCents + second.taxes[0].taxCents).toBe(460);
    expect(first.taxes[1].taxCents + second.taxes[1].taxCents).toBe(644);
    expect(remainingOf(after(after(o, first), second)).total).toBe(0);
  });

  it('refuses units already refunded as over_refund and unknown lines as bad input, beside the field', () => {
    const o = mbOrder({
      items: [
        { id: 1, unitPriceCents: 3500, quantity: 2, refundedQuantity: 2 },
        { id: 2, unitPriceCents: 800, quantity: 1, refundedQuantity: 0 },
      ],
    });
    expect(refused(computeRefund(o, { lines: [{ orderItemId: 1, quantity: 1 }], shipping: false }))).toMatchObject({
      code: 'over_refund',
      fields: { 'lines.0.quantity': expect.stringMatching(/already refunded/) },
    });
    expect(refused(computeRefund(o, { lines: [{ orderItemId: 99, quantity: 1 }], shipping: false }))).toMatchObject({
      code: 'invalid_request',
      fields: { 'lines.0.orderItemId': expect.any(String) },
    });
    expect(
      refused(computeRefund(mbOrder(), { lines: [{ orderItemId: 1, quantity: 3 }], shipping: false })),
    ).toMatchObject({ code: 'invalid_request', fields: { 'lines.0.quantity': expect.stringMatching(/2 unit/) } });
  });

  it('answers refund_changed when the amount sent with lines is not what they come to (a stale preview)', () => {
    expect(
      refused(
        computeRefund(mbOrder(), { lines: [{ orderItemId: 1, quantity: 1 }], shipping: false, amountCents: 3900 }),
      ).code,
    ).toBe('refund_changed');
    expect(
      ok(computeRefund(mbOrder(), { lines: [{ orderItemId: 1, quantity: 1 }], shipping: false, amountCents: 3920 }))
        .totalCents,
    ).toBe(3920);
  });
});

describe('computeRefund by amount alone', () => {
  it('treats it as a goodwill reduction on the goods, the tax inside shared among the goods’ taxes by rate', () => {
    // Tax fraction of a tax-included amount: amount x rate / (100 + rate) (CRA, tax-included pricing, from memory).
    // 11.20 at 12% combined: 11.20 x 12 / 112 = 1.20 -> GST 0.50, RST 0.70; goods 10.00.
    const r = ok(computeRefund(mbOrder(), { lines: [], shipping: false, amountCents: 1120 }));
    expect([r.goodsCents, r.shippingCents, r.totalCents]).toEqual([1000, 0, 1120]);
    expect(taxes(r)).toEqual([
      ['GST', 1000, 50],
      ['RST', 1000, 70],
    ]);
    expect(r.lines).toEqual([]);
  });

  it('refunds everything left, each tax’s remainder exactly, when the amount is all that is left', () => {
    const o = mbOrder();
    const first = ok(computeRefund(o, { lines: [], shipping: false, amountCents: 1000 }));
    const rest = ok(computeRefund(after(o, first), { lines: [], shipping: false, amountCents: 10304 - 1000 }));
    expect(rest.closesOrder).toBe(true);
    expect(first.taxes[0].taxCents + rest.taxes[0].taxCents).toBe(460);
    expect(first.taxes[1].taxCents + rest.taxes[1].taxCents).toBe(644);
    expect(rest.lines.map((l) => [l.orderItemId, l.quantity])).toEqual([
      [1, 2],
      [2, 1],
    ]);
  });

  it('refuses more than is left as over_refund, and nothing asked as bad input', () => {
    expect(refused(computeRefund(mbOrder(), { lines: [], shipping: false, amountCents: 10305 }))).toMatchObject({
      code: 'over_refund',
      fields: { amountCents: expect.stringMatching(/103\.04/) },
    });
    expect(refused(computeRefund(mbOrder(), { lines: [], shipping: false })).code).toBe('invalid_request');
  });

  it('refuses a goodwill sum larger than the goods left, pointing to shipping', () => {
    const r = refused(computeRefund(mbOrder(), { lines: [], shipping: false, amountCents: 9000 }));
    expect(r.code).toBe('invalid_request');
    expect(r.fields.amountCents).toMatch(/shipping/);
  });
});

describe('shareProcessorRefund', () => {
  it('shares a refund made at the processor over what is left, the parts adding up exactly', () => {
    const r = shareProcessorRefund(mbOrder(), 1001);
    expect(r.goodsCents + r.shippingCents + r.taxCents).toBe(1001);
    // 1001 over 78.00 / 14.00 / 4.60 / 6.44 of 103.04 (largest remainder, common practice, no source).
    expect([r.goodsCents, r.shippingCents, r.taxes[0].taxCents, r.taxes[1].taxCents]).toEqual([758, 136, 45, 62]);
  });
});
