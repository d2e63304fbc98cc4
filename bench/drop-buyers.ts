/**
 * The drop's buyers, run in a worker thread so their HTTP clients do not share the server's event loop: the server
 * process is measured with only its own work, as the payment fake's baseline is.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { BenchClient } from './bench-client';

export interface DropBuyersInput {
  base: string;
  buyers: number;
  variantIds: number[];
  shippingMethodId: number;
  /** Makes the buyers' e-mail addresses unique to this run. */
  runId: number;
}

export interface DropBuyersOutput {
  outcomes: { status: number; ms: number }[];
  seconds: number;
}

async function main(input: DropBuyersInput): Promise<DropBuyersOutput> {
  const buyers = await Promise.all(
    Array.from({ length: input.buyers }, async () => {
      const c = new BenchClient(input.base);
      await c.token();
      return c;
    }),
  );
  const started = Date.now();
  const outcomes = await Promise.all(
    buyers.map(async (c, i) => {
      const t0 = performance.now();
      const res = await c.post('/api/orders', {
        items: [{ variantId: input.variantIds[i % input.variantIds.length], quantity: 1 }],
        shipTo: {
          name: `Buyer ${i}`,
          line1: '1 Pad Road',
          city: 'Gopher Flats',
          province: 'MB',
          postalCode: 'R0A 0A0',
          country: 'CA',
        },
        shippingMethodId: input.shippingMethodId,
        email: `drop-${input.runId}-${i}@example.test`,
        paymentToken: 'tok_visa',
      });
      return { status: res.status, ms: performance.now() - t0 };
    }),
  );
  return { outcomes, seconds: (Date.now() - started) / 1000 };
}

// A failure rejects here, and an unhandled rejection ends the worker with an 'error' event for the parent.
void main(workerData as DropBuyersInput).then((out) => parentPort!.postMessage(out));
