import { codeInWords } from '../../contracts/labels/label-of';
import type { TransactionalEmail } from '../mail/outbox';
import { formatCad } from '../platform/money';
import { formatRate } from './tax';
import type { OrderBundle } from './order-rows';
import type { Receipt } from '../../contracts/shop/shop-answers';
import { receiptText } from './receipt';

function receipt(b: OrderBundle): string[] {
  const o = b.order;
  return [
    ...b.items.map(
      (i) =>
        `${i.quantity} x ${i.product_name} (${i.variant_label}, ${i.sku}) @ ${formatCad(i.unit_price_cents)} = ${formatCad(i.unit_price_cents * i.quantity)}`,
    ),
    '',
    `Items: ${formatCad(o.subtotal_cents)}`,
    ...(o.discount_cents ? [`Member discount (${o.discount_percent}%): -${formatCad(o.discount_cents)}`] : []),
    `Shipping (${o.shipping_name}): ${formatCad(o.shipping_cents)}`,
    ...b.taxes.map((t) => `${t.code} ${formatRate(t.rate_percent)}%: ${formatCad(t.amount_cents)}`),
    `Total: ${formatCad(o.total_cents)}`,
  ];
}

/** The order confirmation, once per order; it is also the buyer's receipt. `orderUrl` is the signed link that opens the order without an account. */
export function confirmationEmail(
  b: OrderBundle,
  orderUrl: string,
  teamName: string,
  r: Receipt,
  nextSteps: string[],
): TransactionalEmail {
  const o = b.order;
  const dest =
    o.shipping_code === 'pickup'
      ? 'Pick up at the next club launch; bring this e-mail.'
      : [
          o.ship_name,
          o.ship_line1,
          o.ship_line2,
          `${o.ship_city ?? ''} ${o.ship_province ?? ''} ${o.ship_postal_code ?? ''}`.trim(),
          o.ship_country,
        ]
          .filter(Boolean)
          .join('\n');
  return {
    to: o.email,
    subject: `${teamName} order ${o.number}: thank you`,
    template: 'shop-order-confirmation',
    reason: { order: o.number, team: teamName },
    dedupeKey: `shop-confirmation-${o.id}`,
    text: [
      `Thanks for your order ${o.number}. It is paid and we have it.`,
      '',
      'Receipt',
      ...receiptText(r),
      '',
      ...receipt(b),
      '',
      'Delivery:',
      dest,
      '',
      ...(nextSteps.length ? ['What happens next:', ...nextSteps.map((s) => `- ${s}`), ''] : []),
      `See your order: ${orderUrl}`,
      '',
      teamName,
    ].join('\n'),
  };
}

/** The shipped notice with carrier and tracking; `orderUrl` as for the confirmation. */
export function shippedEmail(b: OrderBundle, orderUrl: string, teamName: string): TransactionalEmail {
  const o = b.order;
  return {
    to: o.email,
    subject: `${teamName} order ${o.number} is on its way`,
    template: 'shop-order-shipped',
    reason: { order: o.number },
    dedupeKey: `shop-shipped-${o.id}`,
    text: [
      `Your order ${o.number} has left the workshop.`,
      '',
      `Carrier: ${o.carrier}`,
      `Tracking number: ${o.tracking_number}`,
      '',
      `See your order: ${orderUrl}`,
      '',
      teamName,
    ].join('\n'),
  };
}

/** A refund notice, once per refund. */
export function refundEmail(
  b: OrderBundle,
  refundId: number,
  amountCents: number,
  teamName: string,
): TransactionalEmail {
  const o = b.order;
  return {
    to: o.email,
    subject: `${teamName} order ${o.number}: refund of ${formatCad(amountCents)}`,
    template: 'shop-order-refund',
    reason: { order: o.number },
    dedupeKey: `shop-refund-${refundId}`,
    text: [
      `We have refunded ${formatCad(amountCents)} on order ${o.number}.`,
      `Refunded so far: ${formatCad(o.refunded_cents)} of ${formatCad(o.total_cents)}.`,
      '',
      'Card refunds usually take a few business days to show on your statement.',
      '',
      teamName,
    ].join('\n'),
  };
}

/** Tells staff a buyer disputed a charge. */
export function disputeEmail(b: OrderBundle, to: string, reason: string): TransactionalEmail {
  return {
    to,
    subject: `Dispute opened on order ${b.order.number}`,
    template: 'shop-order-dispute',
    reason: { order: b.order.number },
    dedupeKey: `shop-dispute-${b.order.id}`,
    text: [
      `The card holder disputed the charge on order ${b.order.number} (${formatCad(b.order.total_cents)}).`,
      `Reason given: ${codeInWords(reason)}`,
      '',
      'Gather the order, shipping and tracking details and answer the dispute in the processor dashboard.',
    ].join('\n'),
  };
}
