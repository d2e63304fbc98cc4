import { Router } from 'express';
import { z } from 'zod';
import type { OrderAnswer } from '../../contracts/shop/shop-answers';
import { OrderBody, PayBody, QuoteBody } from '../../contracts/shop/shop-schemas';
import type { ReadyJson } from '../platform/notified-cache';
import { requireSignedIn } from '../platform/require-role';
import { fields, parse } from '../platform/validate';
import type { PaymentThrottle } from '../payments/payment-throttle';
import type { BuyerOrderService, OrderViewer } from './buyer-order-service';
import type { CatalogueService } from './catalogue-service';
import type { CheckoutService, PaymentOutcome } from './checkout-service';
import { quoteJson, type QuoteService } from './quote-service';
import type { ShopConfigService } from './shop-config-service';

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
  orders: BuyerOrderService;
  config: ShopConfigService;
  throttle: PaymentThrottle;
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
    res.json({ items: await d.config.activeShippingMethods() });
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

/** Answers a payment attempt: 202 while the processor has not said, else `paidStatus` (201 for a new order). */
async function answer(
  d: ShopDeps,
  res: import('express').Response,
  outcome: PaymentOutcome,
  paidStatus: 200 | 201,
): Promise<void> {
  const order = await d.orders.view(outcome.bundle);
  if (outcome.status === 'pending') res.status(202).json({ order, message: outcome.message } satisfies OrderAnswer);
  else res.status(paidStatus).json({ order } satisfies OrderAnswer);
}

/** Keeps the last 20 orders placed or opened in this browser session, so their buyer sees them without an account. */
function rememberOrder(req: import('express').Request, orderId: number): void {
  const ids = (req.session.shopOrderIds ?? []).filter((x) => x !== orderId);
  req.session.shopOrderIds = [...ids.slice(-19), orderId];
}

/** POST /api/orders, GET /api/orders/:id (its buyer, treasurer, admin), POST /api/orders/:id/pay (another attempt). */
export function orderRoutes(d: ShopDeps): Router {
  const r = Router();
  // The e-mailed link's key opens the order in any browser; the session then remembers it like a guest's own order.
  const mayView = async (req: import('express').Request, id: number) => {
    const viewer: OrderViewer = {
      userId: req.user?.id ?? null,
      roles: req.user?.roles ?? [],
      sessionOrderIds: req.session.shopOrderIds ?? [],
      key: typeof req.query.key === 'string' ? req.query.key : '',
    };
    const { bundle, byKey } = await d.orders.open(id, viewer);
    if (byKey) rememberOrder(req, id);
    return bundle;
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
    res.json({ order: await d.orders.detail(b) } satisfies OrderAnswer);
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
    res.json(await d.orders.accountOrders(req.user!.id));
  });
  return r;
}
