import express, { Router } from 'express';
import type { CardEntry } from '../../contracts/shop/shop-answers';
import type { Config } from '../config';
import type { WebhookService } from './webhook-service';

/**
 * /api/payments: how the browser takes a card, and the processor's signed events (the webhook takes its raw body and is
 * exempt from CSRF and the JSON parser).
 */
export function paymentRoutes(config: Pick<Config['stripe'], 'publishableKey'>, webhooks: WebhookService): Router {
  const r = Router();
  // With a publishable key the browser tokenises the card with Stripe.js; without one it offers the labelled test tokens.
  r.get('/card-entry', function cardEntry(_req, res) {
    const entry: CardEntry = config.publishableKey
      ? { mode: 'stripe-js', publishableKey: config.publishableKey }
      : { mode: 'test-cards', publishableKey: null };
    res.json(entry);
  });
  r.post('/webhook', express.raw({ type: 'application/json', limit: '256kb' }), async function receiveEvent(req, res) {
    const handled = await webhooks.receive(req.body, req.header('stripe-signature'));
    res.json({ received: true, replay: !handled });
  });
  return r;
}
