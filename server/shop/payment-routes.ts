import express, { Router } from 'express';
import Stripe from 'stripe';
import type { Config } from '../config';
import { badRequest } from '../platform/app-error';
import type { WebhookService } from './webhook-service';

/**
 * /api/payments: how the browser takes a card, and the processor's signed events (the webhook takes its raw body and is
 * exempt from CSRF and the JSON parser).
 */
export function paymentRoutes(stripe: Stripe, config: Pick<Config['stripe'], 'webhookSecret' | 'publishableKey'>, webhooks: WebhookService): Router {
  const r = Router();
  // With a publishable key the browser tokenises the card with Stripe.js; without one it offers the labelled test tokens.
  r.get('/card-entry', function cardEntry(_req, res) {
    res.json(config.publishableKey ? { mode: 'stripe-js', publishableKey: config.publishableKey } : { mode: 'test-cards', publishableKey: null });
  });
  r.post('/webhook', express.raw({ type: 'application/json', limit: '256kb' }), async function receiveEvent(req, res) {
    const signature = req.header('stripe-signature');
    if (!signature || !Buffer.isBuffer(req.body)) throw badRequest('Missing or unsigned event.');
    let event: Stripe.Event;
    try {
      event = stripe.webhooks.constructEvent(req.body, signature, config.webhookSecret);
    } catch {
      throw badRequest('The event signature does not match.');
    }
    const handled = await webhooks.handle(event);
    res.json({ received: true, replay: !handled });
  });
  return r;
}
