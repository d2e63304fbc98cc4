import Stripe from 'stripe';
import type { Config } from '../config';

/** The Stripe SDK pointed at `STRIPE_API_BASE` (the local fake in development and tests). */
export function createStripe(config: Config): Stripe {
  const base = new URL(config.stripe.apiBase);
  return new Stripe(config.stripe.secretKey, {
    host: base.hostname,
    port: base.port ? Number(base.port) : base.protocol === 'https:' ? 443 : 80,
    protocol: base.protocol === 'https:' ? 'https' : 'http',
    // Retries are ours (see payment-gateway), so each one reuses the caller's idempotency key on purpose.
    maxNetworkRetries: 0,
    timeout: 8000,
  });
}
