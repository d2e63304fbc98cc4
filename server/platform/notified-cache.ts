import { createHash } from 'node:crypto';
import type { DatabaseNotifications } from './database-notifications';

/** A JSON answer serialised once, with a version that names its content (the same text has the same version everywhere). */
export interface ReadyJson {
  json: string;
  version: string;
}

/** What a builder read: the value and the instants (ms) between which it stays true as time passes. */
export interface Built {
  value: unknown;
  validFrom: number;
  validUntil: number;
}

interface Entry {
  ready: ReadyJson;
  generation: number;
  validFrom: number;
  validUntil: number;
}

/**
 * Ready JSON answers built from the database and dropped when a commit notifies `channel` (in any process). A copy is
 * only used after `caughtUp()`, so an answer is never older than the request: a read that starts after a commit
 * returned shows that commit. While this process cannot listen, every answer is built afresh.
 */
export class NotifiedCache {
  private generation = 0;
  private readonly entries = new Map<string, Entry>();
  private readonly building = new Map<string, { generation: number; promise: Promise<Built | null> }>();

  constructor(
    private readonly notifications: DatabaseNotifications,
    channel: string,
  ) {
    notifications.watch(channel, () => {
      this.generation++;
      this.entries.clear();
    });
  }

  /** The answer under `key` at `now`; `build` reads it when no fresh copy is held, null meaning "nothing there" (not kept). */
  async get(key: string, now: Date, build: (now: Date) => Promise<Built | null>): Promise<ReadyJson | null> {
    const listening = await this.notifications.caughtUp();
    const t = now.getTime();
    const generation = this.generation;
    const held = this.entries.get(key);
    if (listening && held && held.generation === generation && held.validFrom <= t && t < held.validUntil) return held.ready;
    // A build under way at this generation began after every change this request must see, so it may be shared.
    const shared = this.building.get(key);
    const fits = (b: Built | null) => !b || (b.validFrom <= t && t < b.validUntil);
    if (listening && shared && shared.generation === generation) {
      const built = await shared.promise;
      if (fits(built)) return built && this.held(key, built, generation, listening);
    }
    const promise = build(now);
    if (listening) this.building.set(key, { generation, promise });
    try {
      const built = await promise;
      return built && this.held(key, built, generation, listening);
    } finally {
      if (this.building.get(key)?.promise === promise) this.building.delete(key);
    }
  }

  private held(key: string, built: Built, generation: number, listening: boolean): ReadyJson {
    const existing = this.entries.get(key);
    if (existing && existing.generation === generation && existing.validFrom === built.validFrom && existing.validUntil === built.validUntil) return existing.ready;
    const json = JSON.stringify(built.value);
    const ready = { json, version: createHash('sha1').update(json).digest('base64url') };
    // A change committed while this was being read makes it stale for the requests after it: keep it only if none came.
    if (listening && generation === this.generation) this.entries.set(key, { ready, generation, validFrom: built.validFrom, validUntil: built.validUntil });
    return ready;
  }
}
