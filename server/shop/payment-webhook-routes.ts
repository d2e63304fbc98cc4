import express, { Router } from 'express';
import Stripe from 'stripe';
import { badRequest } from '../platform/app-error';
import type { WebhookService } from './webhook-service';

/** POST /api/payments/webhook: the processor's signed events (raw body; exempt from CSRF and the JSON parser). */
export function paymentWebhookRoutes(stripe: Stripe, secret: string, webhooks: WebhookService): Router {
  const r = Router();
  r.post('/webhook', express.raw({ type: 'application/json', limit: '256kb' }), async function receiveEvent(req, res) {
    const signature = req.header('stripe-signature');
    if (!signature || !Buffer.isBuffer(req.body)) throw badRequest('Missing or unsigned event.');
    let event: Stripe.Event;
    try {
      event = stripe.webhooks.constructEvent(req.body, signature, secret);
    } catch {
      throw badRequest('The event signature does not match.');
    }
    const handled = await webhooks.handle(event);
    res.json({ received: true, replay: !handled });
  });
  return r;
}
