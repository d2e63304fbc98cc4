import { Client } from 'pg';
import type { Logger } from 'pino';

/** After a failed attempt to listen, reads go to the database for this long before the next attempt (common practice, no source). */
const RETRY_AFTER_MS = 1000;

const CHANNEL = /^[a-z_]{1,63}$/;

/**
 * One PostgreSQL connection per process that LISTENs for what other processes (and this one) commit, so in-memory
 * copies of the database are dropped when their rows change, without a timer. Opened at the first `caughtUp()`.
 */
export class DatabaseNotifications {
  private client: Client | null = null;
  private listening: Promise<boolean> | null = null;
  private retryAt = 0;
  private closed = false;
  private readonly watchers = new Map<string, (() => void)[]>();
  private inFlight: Promise<boolean> | null = null;
  private queued: Promise<boolean> | null = null;

  constructor(
    private readonly databaseUrl: string,
    private readonly log: Logger,
  ) {}

  /** Calls `changed` after every commit that notified `channel`, and whenever notifications may have been missed. */
  watch(channel: string, changed: () => void): void {
    if (!CHANNEL.test(channel)) throw new Error(`not a channel name: ${channel}`);
    const list = this.watchers.get(channel);
    if (list) list.push(changed);
    else {
      this.watchers.set(channel, [changed]);
      this.client?.query(`LISTEN ${channel}`).catch(() => undefined);
    }
  }

  /**
   * Resolves true once every notification committed before the call has reached the watchers, so a copy still held
   * afterwards is as fresh as a read would be; false when this process is not listening (read the database).
   * Calls in flight together share one round trip on the listening connection: PostgreSQL delivers a listener its
   * pending notifications before the answer to its next query.
   */
  async caughtUp(): Promise<boolean> {
    if (!(await this.listen())) return false;
    // A round trip already on its way may have been sent before a commit this call must see: wait for the next.
    if (!this.inFlight) {
      this.inFlight = this.roundTrip().finally(() => (this.inFlight = null));
      return this.inFlight;
    }
    this.queued ??= this.inFlight.then(() => {
      this.queued = null;
      return this.caughtUp();
    });
    return this.queued;
  }

  /** Stops listening and releases the LISTEN connection, so the process can exit. */
  async close(): Promise<void> {
    this.closed = true;
    const client = this.client;
    this.client = null;
    await client?.end().catch(() => undefined);
  }

  private async roundTrip(): Promise<boolean> {
    const client = this.client;
    if (!client) return false;
    try {
      await client.query('SELECT 1');
      return this.client === client;
    } catch {
      return false;
    }
  }

  private listen(): Promise<boolean> {
    if (this.closed || (!this.listening && Date.now() < this.retryAt)) return Promise.resolve(false);
    this.listening ??= this.connect();
    return this.listening;
  }

  private async connect(): Promise<boolean> {
    const client = new Client({ connectionString: this.databaseUrl });
    client.on('notification', (m) => this.changed(m.channel));
    client.on('error', () => this.lost(client));
    client.on('end', () => this.lost(client));
    try {
      await client.connect();
      for (const channel of this.watchers.keys()) await client.query(`LISTEN ${channel}`);
      if (this.closed) throw new Error('closed');
      this.client = client;
      // Nobody listened until now: whatever a watcher holds may be stale.
      for (const channel of this.watchers.keys()) this.changed(channel);
      return true;
    } catch (err) {
      if (!this.closed)
        this.log.warn({ err }, 'could not listen for database notifications; reading the database instead');
      this.retryAt = Date.now() + RETRY_AFTER_MS;
      this.listening = null;
      await client.end().catch(() => undefined);
      return false;
    }
  }

  private lost(client: Client): void {
    if (this.client !== client) return;
    this.client = null;
    this.listening = null;
    if (!this.closed) this.log.warn('the database notification connection closed; listening again at the next read');
    for (const channel of this.watchers.keys()) this.changed(channel);
  }

  private changed(channel: string): void {
    for (const fn of this.watchers.get(channel) ?? []) fn();
  }
}
