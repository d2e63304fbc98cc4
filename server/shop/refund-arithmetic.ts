/**
 * What a shop refund gives back, as a credit note would state it: pure arithmetic on the original order's figures and
 * what earlier refunds (settled or still claimed) already gave back. No clock, no database.
 */
import { percentOf, shareProportionally } from './pricing';
import { divideHalfUp, rateUnits, taxOn, type TaxCode } from './tax';

/** One tax charged on the order. `onShipping` says whether its base included the shipping charge. */
export interface OrderTax {
  code: TaxCode;
  jurisdiction: string;
  ratePercent: string;
  taxableCents: number;
  amountCents: number;
  onShipping: boolean;
}

/** What the order charged, and what refunds already claimed (requested or succeeded), per part. */
export interface RefundableOrder {
  discountPercent: number;
  goodsCents: number;
  shippingCents: number;
  items: { id: number; unitPriceCents: number; quantity: number; refundedQuantity: number }[];
  taxes: OrderTax[];
  refunded: { goodsCents: number; shippingCents: number; taxCents: Record<string, number> };
}

/** What staff ask for: lines and quantities, the shipping charge, or a sum of money alone. */
export interface RefundAsk {
  lines: { orderItemId: number; quantity: number }[];
  shipping: boolean;
  amountCents?: number;
}

export interface RefundTax {
  code: TaxCode;
  jurisdiction: string;
  ratePercent: string;
  taxableCents: number;
  taxCents: number;
}

/** A refund's parts: goods, shipping and each tax add up to `totalCents`. */
export interface RefundBreakdown {
  lines: { orderItemId: number; quantity: number; goodsCents: number }[];
  goodsCents: number;
  shippingCents: number;
  taxes: RefundTax[];
  taxCents: number;
  totalCents: number;
  /** After this refund nothing is left to refund on the order. */
  closesOrder: boolean;
}

/** A refund the rules refuse: `over_refund` when earlier refunds already took what was asked, else bad input. */
export interface RefundRefusal {
  code: 'over_refund' | 'invalid_request' | 'refund_changed';
  message: string;
  fields: Record<string, string>;
}

export const taxKey = (t: { code: string; jurisdiction: string }) => `${t.code}:${t.jurisdiction}`;

const sum = (xs: number[]) => xs.reduce((s, x) => s + x, 0);
const dollars = (cents: number) => `$${(cents / 100).toFixed(2)}`;

/** What is still refundable per part of the order. */
export function remainingOf(o: RefundableOrder) {
  const taxes = o.taxes.map((t) => Math.max(0, t.amountCents - (o.refunded.taxCents[taxKey(t)] ?? 0)));
  const goods = Math.max(0, o.goodsCents - o.refunded.goodsCents);
  const shipping = Math.max(0, o.shippingCents - o.refunded.shippingCents);
  return { goods, shipping, taxes, total: goods + shipping + sum(taxes) };
}

function taxLines(o: RefundableOrder, amounts: number[], goods: number, shipping: number): RefundTax[] {
  return o.taxes
    .map((t, i) => ({
      code: t.code,
      jurisdiction: t.jurisdiction,
      ratePercent: t.ratePercent,
      taxableCents: goods + (t.onShipping ? shipping : 0),
      taxCents: amounts[i],
    }))
    .filter((t) => t.taxCents !== 0 || t.taxableCents !== 0);
}

function breakdown(
  o: RefundableOrder,
  lines: RefundBreakdown['lines'],
  goods: number,
  shipping: number,
  taxes: number[],
): RefundBreakdown {
  const left = remainingOf(o);
  const taxCents = sum(taxes);
  const totalCents = goods + shipping + taxCents;
  return {
    lines,
    goodsCents: goods,
    shippingCents: shipping,
    taxes: taxLines(o, taxes, goods, shipping),
    taxCents,
    totalCents,
    closesOrder: totalCents === left.total,
  };
}

/** Everything still refundable: every unit left, the shipping left and each tax's remainder. */
export function refundEverythingLeft(o: RefundableOrder): RefundBreakdown {
  const left = remainingOf(o);
  const lines = o.items
    .filter((i) => i.quantity > i.refundedQuantity)
    .map((i) => ({ orderItemId: i.id, quantity: i.quantity - i.refundedQuantity, goodsCents: 0 }));
  // The lines' goods are the remainder of the order's goods, shared by line value so they add up exactly.
  const shares = shareProportionally(
    left.goods,
    lines.map((l) => l.quantity * o.items.find((i) => i.id === l.orderItemId)!.unitPriceCents),
  );
  lines.forEach((l, i) => (l.goodsCents = shares[i]));
  return breakdown(o, lines, left.goods, left.shipping, left.taxes);
}

/**
 * Lines and/or shipping: the goods of those lines after the order's discount, the shipping charge, and each tax at the
 * order's rate on what is refunded (a credit note for the tax on the refunded supply, not a share of the total). Once
 * a tax's whole base has been refunded, its remainder is reversed so the refunds add up to the tax charged.
 */
function refundLines(o: RefundableOrder, ask: RefundAsk): RefundBreakdown | RefundRefusal {
  const left = remainingOf(o);
  const fields: Record<string, string> = {};
  const lines: RefundBreakdown['lines'] = [];
  let overClaim = false;
  ask.lines.forEach((l, n) => {
    const item = o.items.find((i) => i.id === l.orderItemId);
    if (!item) return void (fields[`lines.${n}.orderItemId`] = 'That line is not on this order.');
    if (lines.some((x) => x.orderItemId === l.orderItemId))
      return void (fields[`lines.${n}.orderItemId`] = 'That line is listed twice.');
    const open = item.quantity - item.refundedQuantity;
    if (l.quantity > item.quantity)
      return void (fields[`lines.${n}.quantity`] = `This line has ${item.quantity} unit(s).`);
    if (l.quantity > open) {
      overClaim = true;
      return void (fields[`lines.${n}.quantity`] = open
        ? `Only ${open} unit(s) of this line are left to refund.`
        : 'This line is already refunded.');
    }
    const gross = item.unitPriceCents * l.quantity;
    lines.push({ orderItemId: item.id, quantity: l.quantity, goodsCents: gross - percentOf(gross, o.discountPercent) });
  });
  if (ask.shipping && left.shipping === 0) {
    if (o.shippingCents === 0) fields.shipping = 'This order had no shipping charge.';
    else {
      overClaim = true;
      fields.shipping = 'Shipping is already refunded.';
    }
  }
  if (Object.keys(fields).length)
    return {
      code: overClaim ? 'over_refund' : 'invalid_request',
      message: overClaim ? 'Part of that refund was already refunded.' : 'Check the lines to refund.',
      fields,
    };

  const allUnits = o.items.every(
    (i) => i.quantity - i.refundedQuantity === (lines.find((l) => l.orderItemId === i.id)?.quantity ?? 0),
  );
  const goods = allUnits ? left.goods : Math.min(left.goods, sum(lines.map((l) => l.goodsCents)));
  if (allUnits) {
    const shares = shareProportionally(
      goods,
      lines.map((l) => l.goodsCents),
    );
    lines.forEach((l, i) => (l.goodsCents = shares[i]));
  }
  const shipping = ask.shipping ? left.shipping : 0;
  const shippingDone = shipping === left.shipping;
  const taxes = o.taxes.map((t, i) => {
    const base = goods + (t.onShipping ? shipping : 0);
    const wholeBase = allUnits && (!t.onShipping || shippingDone);
    return wholeBase ? left.taxes[i] : Math.min(left.taxes[i], taxOn(base, t.ratePercent));
  });
  return breakdown(o, lines, goods, shipping, taxes);
}

/**
 * A sum of money alone, tax included: a goodwill reduction of the goods' price. The tax inside it is the tax fraction
 * of the goods' combined rate (amount x rate / (100 + rate)), shared among the goods' taxes by rate.
 */
function refundGoodwill(o: RefundableOrder, amountCents: number): RefundBreakdown | RefundRefusal {
  const left = remainingOf(o);
  const units = o.taxes.map((t) => rateUnits(t.ratePercent));
  const combined = sum(units);
  const taxTotal = combined ? divideHalfUp(BigInt(amountCents) * BigInt(combined), BigInt(1000000 + combined)) : 0;
  const taxes = shareProportionally(taxTotal, units);
  const goods = amountCents - taxTotal;
  if (goods > left.goods || taxes.some((x, i) => x > left.taxes[i])) {
    // Past earlier refunds it conflicts with what they took; on an untouched order it could never fit.
    const earlier = o.refunded.goodsCents > 0 || Object.values(o.refunded.taxCents).some((x) => x > 0);
    return {
      code: earlier ? 'over_refund' : 'invalid_request',
      message: 'That is more than the goods left to refund.',
      fields: {
        amountCents: `A reduction on the goods can be at most ${dollars(left.goods + sum(left.taxes.map((x, i) => Math.min(x, taxOn(left.goods, o.taxes[i].ratePercent)))))}; tick shipping or lines to refund more.`,
      },
    };
  }
  return breakdown(o, [], goods, 0, taxes);
}

/** The refund that `ask` comes to on order `o`, or why it is refused. */
export function computeRefund(o: RefundableOrder, ask: RefundAsk): RefundBreakdown | RefundRefusal {
  const left = remainingOf(o);
  const byLines = ask.lines.length > 0 || ask.shipping;
  if (!byLines && ask.amountCents === undefined)
    return {
      code: 'invalid_request',
      message: 'Say what to refund.',
      fields: { amountCents: 'Tick a line or shipping, or enter an amount.' },
    };
  if (left.total === 0)
    return {
      code: 'over_refund',
      message: 'This order is already refunded in full.',
      fields: { amountCents: 'Nothing is left to refund.' },
    };
  let result: RefundBreakdown | RefundRefusal;
  if (byLines) result = refundLines(o, ask);
  else if (ask.amountCents! > left.total)
    return {
      code: 'over_refund',
      message: 'That refund is larger than what is left to refund.',
      fields: { amountCents: `At most ${dollars(left.total)} is left to refund.` },
    };
  else if (ask.amountCents === left.total) result = refundEverythingLeft(o);
  else result = refundGoodwill(o, ask.amountCents!);
  if ('code' in result) return result;
  if (result.totalCents < 1)
    return {
      code: 'invalid_request',
      message: 'That refund comes to nothing.',
      fields: { amountCents: 'The refund must be at least $0.01.' },
    };
  if (byLines && ask.amountCents !== undefined && ask.amountCents !== result.totalCents) {
    return {
      code: 'refund_changed',
      message: `Those lines now come to ${dollars(result.totalCents)}; check the refund again.`,
      fields: { amountCents: `The refund comes to ${dollars(result.totalCents)}.` },
    };
  }
  return result;
}

/**
 * A refund the processor made without Padside (its dashboard): nothing says what it was for, so it is shared over
 * what is left of goods, shipping and each tax, in proportion (largest remainder, so the parts add up).
 */
export function shareProcessorRefund(o: RefundableOrder, amountCents: number): RefundBreakdown {
  const left = remainingOf(o);
  if (amountCents >= left.total) return refundEverythingLeft(o);
  const [goods, shipping, ...taxes] = shareProportionally(amountCents, [left.goods, left.shipping, ...left.taxes]);
  return breakdown(o, [], goods, shipping, taxes);
}
