import express, { Router } from 'express';
import Stripe from 'stripe';
import type { Config } from '../config';
import { badRequest } from '../platform/app-error';
import type { WebhookService } from './webhook-service';

/** How far a signature timestamp may lie from now, either way: the SDK's default tolerance (five minutes). */
export const SIGNATURE_TOLERANCE_SECONDS = 300;

/**
 * True when the signature header's `t=` lies more than the tolerance ahead of `nowSeconds`. The SDK refuses only old
 * timestamps; one from the future would stay replayable until it falls due, so it is refused too.
 */
export function signedInTheFuture(
  header: string,
  nowSeconds: number,
  toleranceSeconds = SIGNATURE_TOLERANCE_SECONDS,
): boolean {
  // Every `t=` item is judged, whichever one a parser would keep.
  return header.split(',').some((item) => {
    const [key, value] = item.split('=');
    return key.trim() === 't' && !(Number(value) <= nowSeconds + toleranceSeconds);
  });
}

/**
 * /api/payments: how the browser takes a card, and the processor's signed events (the webhook takes its raw body and is
 * exempt from CSRF and the JSON parser).
 */
export function paymentRoutes(
  stripe: Stripe,
  config: Pick<Config['stripe'], 'webhookSecret' | 'publishableKey'>,
  webhooks: WebhookService,
): Router {
  const r = Router();
  // With a publishable key the browser tokenises the card with Stripe.js; without one it offers the labelled test tokens.
  r.get('/card-entry', function cardEntry(_req, res) {
    res.json(
      config.publishableKey
        ? { mode: 'stripe-js', publishableKey: config.publishableKey }
        : { mode: 'test-cards', publishableKey: null },
    );
  });
  r.post('/webhook', express.raw({ type: 'application/json', limit: '256kb' }), async function receiveEvent(req, res) {
    const signature = req.header('stripe-signature');
    if (!signature || !Buffer.isBuffer(req.body)) throw badRequest('Missing or unsigned event.');
    // The system clock, as the SDK's own check of old timestamps uses: both bounds then judge against the same now.
    if (signedInTheFuture(signature, Math.floor(Date.now() / 1000)))
      throw badRequest('The event signature timestamp is in the future.');
    let event: Stripe.Event;
    try {
      event = stripe.webhooks.constructEvent(req.body, signature, config.webhookSecret, SIGNATURE_TOLERANCE_SECONDS);
    } catch {
      throw badRequest('The event signature does not match.');
    }
    const handled = await webhooks.handle(event);
    res.json({ received: true, replay: !handled });
  });
  return r;
}
