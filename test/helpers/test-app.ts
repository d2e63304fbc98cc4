import { createApp, type PadsideApp } from '../../server/app';
import { loadConfig, type Config } from '../../server/config';
import { closeDeps, createDeps, type AppDeps } from '../../server/deps';
import type Stripe from 'stripe';
import { createStripe } from '../../server/payments/stripe-client';
import type { Clock } from '../../server/platform/clock';

export interface TestApp {
  app: PadsideApp;
  deps: AppDeps;
  config: Config;
  /** The processor as the tests see it (its own client, not the app's gateway): to check or act on what it holds. */
  processor: Stripe;
  close(): Promise<void>;
}

/** The real app against the throwaway test database that `npm test` started. */
export function buildTestApp(overrides: Partial<AppDeps> & { env?: Record<string, string> } = {}): TestApp {
  const { env, ...depOverrides } = overrides;
  const config = loadConfig({ ...process.env, ...env });
  const deps = createDeps(config, depOverrides);
  const app = createApp(deps);
  return {
    app,
    deps,
    config,
    processor: createStripe(config),
    close: async () => {
      await app.close();
      await closeDeps(deps);
    },
  };
}

/** A clock tests can move. */
export function fixedClock(iso: string): Clock & { set(iso: string): void } {
  let now = new Date(iso);
  return { now: () => new Date(now), set: (next: string) => (now = new Date(next)) };
}
