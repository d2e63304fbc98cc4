import { createHash } from 'node:crypto';
import type { DatabaseNotifications } from './database-notifications';

/** A JSON answer serialised once, with a version that names its content (the same text has the same version everywhere). */
export interface ReadyJson {
  json: string;
  version: string;
}

/** Serialises `value` once for many answers. */
export function readyJson(value: unknown): ReadyJson {
  const json = JSON.stringify(value);
  return { json, version: createHash('sha1').update(json).digest('base64url') };
}

/** What a builder read: the value and the instants (ms) between which it stays true as time passes. */
export interface Built<V> {
  value: V;
  validFrom: number;
  validUntil: number;
}

/** For values that time alone never changes. */
export const ALWAYS = { validFrom: -Infinity, validUntil: Infinity } as const;

interface Entry<V> extends Built<V> {
  generation: number;
}

/**
 * Values built from the database and dropped when a commit notifies `channel` (in any process). A copy is only used
 * after `caughtUp()`, so it is never older than the request: a read that starts after a commit returned sees that
 * commit. While this process cannot listen, every value is built afresh.
 */
export class NotifiedCache<V> {
  private generation = 0;
  private readonly entries = new Map<string, Entry<V>>();
  private readonly building = new Map<string, { generation: number; promise: Promise<Built<V> | null> }>();

  constructor(
    private readonly notifications: DatabaseNotifications,
    channel: string,
  ) {
    notifications.watch(channel, () => {
      this.generation++;
      this.entries.clear();
    });
  }

  /** The value under `key` at `now`; `build` reads it when no fresh copy is held, null meaning "nothing there" (not kept). */
  async get(key: string, now: Date, build: (now: Date) => Promise<Built<V> | null>): Promise<V | null> {
    const listening = await this.notifications.caughtUp();
    const t = now.getTime();
    const fits = (b: Built<V> | null): b is Built<V> => b !== null && b.validFrom <= t && t < b.validUntil;
    const generation = this.generation;
    const held = this.entries.get(key);
    if (listening && held?.generation === generation && fits(held)) return held.value;
    // A build under way at this generation began after every change this request must see, so it may be shared.
    const shared = this.building.get(key);
    if (listening && shared?.generation === generation) {
      const built = await shared.promise;
      if (!built || fits(built)) return built?.value ?? null;
    }
    const promise = build(now);
    if (listening) this.building.set(key, { generation, promise });
    try {
      const built = await promise;
      // A change committed while this was being read makes it stale for later requests: keep it only if none came.
      if (built && listening && generation === this.generation) this.entries.set(key, { ...built, generation });
      return built?.value ?? null;
    } finally {
      if (this.building.get(key)?.promise === promise) this.building.delete(key);
    }
  }
}
