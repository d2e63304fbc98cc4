import { Router } from 'express';
import { z } from 'zod';
import type { AccountOrders, Order, OrderAnswer, ShippingMethod } from '../../contracts/shop/shop-answers';
import { OrderBody, PayBody, QuoteBody } from '../../contracts/shop/shop-schemas';
import { notFound } from '../platform/app-error';
import type { ReadyJson } from '../platform/notified-cache';
import { requireSignedIn } from '../platform/require-role';
import type { Role } from '../platform/roles';
import { fields, parse } from '../platform/validate';
import type { PaymentThrottle } from '../payments/payment-throttle';
import type { CatalogueService } from './catalogue-service';
import type { CheckoutService, PaymentOutcome } from './checkout-service';
import type { OrderGuide } from './order-guide';
import type { OrderLinks } from './order-links';
import type { OrderBundle, OrderRepository } from './order-repository';
import { orderJson } from './order-view';
import { quoteJson, type QuoteService } from './quote-service';
import type { ReceiptService } from './receipt-service';
import type { ShopConfigRepository } from './shop-config-repository';

declare module 'express-session' {
  interface SessionData {
    /** Orders placed in this browser session, so a guest can see their own confirmation. */
    shopOrderIds?: number[];
  }
}

export interface ShopDeps {
  catalogue: CatalogueService;
  quotes: QuoteService;
  checkout: CheckoutService;
  orders: OrderRepository;
  config: ShopConfigRepository;
  receipts: ReceiptService;
  links: OrderLinks;
  throttle: PaymentThrottle;
  guide: OrderGuide;
  now(): Date;
}

/**
 * A ready catalogue answer. Browsers must ask again each time (remaining units change with every sale) but may send
 * the version they hold: an unchanged answer is then a 304 without a body (Express compares If-None-Match).
 */
function sendReady(res: import('express').Response, ready: ReadyJson): void {
  res.set('Cache-Control', 'no-cache').set('ETag', `"${ready.version}"`).type('json').send(ready.json);
}

/**
 * GET /api/products ({items}), GET /api/products/:slug (the product itself). Mounted before the session: they are
 * the same for everyone, and a visitor browsing the shop should cost no session read or write.
 */
export function productRoutes(d: ShopDeps): Router {
  const r = Router();
  r.get('/', async function listProducts(_req, res) {
    sendReady(res, await d.catalogue.storefrontList());
  });
  r.get('/:slug', async function showProduct(req, res) {
    const slug = parse(z.string().regex(/^[a-z0-9-]{1,80}$/, 'Not a product address.'), req.params.slug);
    sendReady(res, await d.catalogue.storefrontProduct(slug));
  });
  return r;
}

/** GET /api/shipping-methods. */
export function shippingMethodRoutes(d: ShopDeps): Router {
  const r = Router();
  r.get('/', async function listShippingMethods(_req, res) {
    const items: ShippingMethod[] = (await d.config.activeShippingMethods()).map((m) => ({
      id: m.id,
      code: m.code,
      name: m.name,
      brackets: m.brackets,
    }));
    res.json({ items });
  });
  return r;
}

/** POST /api/checkout/quote. */
export function checkoutRoutes(d: ShopDeps): Router {
  const r = Router();
  r.post('/quote', async function quoteCart(req, res) {
    const body = parse(QuoteBody, req.body);
    res.json(quoteJson(await d.quotes.quote(body, req.user?.roles ?? [], d.now())));
  });
  return r;
}

/** The buyer's view of an order: the order and, once paid, its receipt. */
async function buyerView(d: ShopDeps, b: OrderBundle): Promise<Order> {
  return { ...orderJson(b), receipt: await d.receipts.forOrder(b) };
}

/** Answers a payment attempt: 202 while the processor has not said, else `paidStatus` (201 for a new order). */
async function answer(
  d: ShopDeps,
  res: import('express').Response,
  outcome: PaymentOutcome,
  paidStatus: 200 | 201,
): Promise<void> {
  const order = await buyerView(d, outcome.bundle);
  if (outcome.status === 'pending') res.status(202).json({ order, message: outcome.message } satisfies OrderAnswer);
  else res.status(paidStatus).json({ order } satisfies OrderAnswer);
}

/** Besides the buyer, only these roles handle shop orders (an editor has no business with addresses or payments). */
export const ORDER_ROLES: readonly Role[] = ['treasurer', 'admin'];

/** Keeps the last 20 orders placed or opened in this browser session, so their buyer sees them without an account. */
function rememberOrder(req: import('express').Request, orderId: number): void {
  const ids = (req.session.shopOrderIds ?? []).filter((x) => x !== orderId);
  req.session.shopOrderIds = [...ids.slice(-19), orderId];
}

/** POST /api/orders, GET /api/orders/:id (its buyer, treasurer, admin), POST /api/orders/:id/pay (another attempt). */
export function orderRoutes(d: ShopDeps): Router {
  const r = Router();
  // The e-mailed link's key opens the order in any browser; the session then remembers it like a guest's own order.
  const opensWithKey = (req: import('express').Request, orderId: number, email: string) => {
    const key = typeof req.query.key === 'string' ? req.query.key : '';
    if (!key || !d.links.verify(orderId, email, key)) return false;
    rememberOrder(req, orderId);
    return true;
  };
  // Anyone else gets the same 404 as an id that does not exist, so order ids are not confirmed to strangers (ASVS 4.0.3 4.2.1).
  const mayView = async (req: import('express').Request, id: number) => {
    const b = await d.orders.find(id);
    const own =
      b &&
      ((req.user && b.order.user_id === req.user.id) ||
        req.session.shopOrderIds?.includes(id) ||
        opensWithKey(req, b.order.id, b.order.email));
    if (!b || !(own || req.user?.roles.some((x) => ORDER_ROLES.includes(x)))) throw notFound('No such order.');
    return b;
  };
  r.post('/', async function placeOrder(req, res) {
    const body = parse(OrderBody, req.body);
    // The session already holds the CSRF token, so its id is stable between attempts.
    const payer = { sessionId: req.sessionID, email: body.email, address: body.shipTo };
    const outcome = await d.throttle.attempt(
      payer,
      () => d.checkout.placeOrder(body, req.user ?? null),
      (o) => o.status === 'paid',
    );
    rememberOrder(req, outcome.bundle.order.id);
    await answer(d, res, outcome, 201);
  });
  r.get('/:id', async function showOrder(req, res) {
    const id = parse(fields.id, req.params.id);
    const b = await mayView(req, id);
    res.json({ order: { ...(await buyerView(d, b)), nextSteps: await d.guide.nextSteps(b) } } satisfies OrderAnswer);
  });
  r.post('/:id/pay', async function payAgain(req, res) {
    const id = parse(fields.id, req.params.id);
    const { order } = await mayView(req, id);
    const { paymentToken } = parse(PayBody, req.body);
    const payer = {
      sessionId: req.sessionID,
      email: order.email,
      address: { line1: order.ship_line1, postalCode: order.ship_postal_code, country: order.ship_country },
    };
    await answer(
      d,
      res,
      await d.throttle.attempt(
        payer,
        () => d.checkout.pay(id, paymentToken),
        (o) => o.status === 'paid',
      ),
      200,
    );
  });
  return r;
}

/** GET /api/account/orders: the signed-in buyer's orders, and the address of the latest mailed one (`lastShipTo`). */
export function accountOrderRoutes(d: ShopDeps): Router {
  const r = Router();
  r.get('/', requireSignedIn, async function myOrders(req, res) {
    const rows = await d.orders.forUser(req.user!.id);
    const last = await d.orders.lastShipTo(req.user!.id);
    const lastShipTo = last && {
      name: last.ship_name,
      line1: last.ship_line1 ?? '',
      line2: last.ship_line2 ?? '',
      city: last.ship_city ?? '',
      province: last.ship_province ?? '',
      postalCode: last.ship_postal_code ?? '',
      country: last.ship_country,
    };
    const answer: AccountOrders = {
      lastShipTo,
      items: rows.map((o) => ({
        id: o.id,
        number: o.number,
        status: o.status,
        createdAt: o.created_at.toISOString(),
        totalCents: o.total_cents,
        refundedCents: o.refunded_cents,
        shippingName: o.shipping_name,
        trackingNumber: o.tracking_number,
        carrier: o.carrier,
      })),
    };
    res.json(answer);
  });
  return r;
}
