import type { Logger } from 'pino';

/**
 * Work a service starts once the caller has its answer, so the answer takes the same time whatever the work finds
 * (an existing account or not). Failures are logged; `settled()` waits for what is still running (tests, shutdown).
 */
export class AfterAnswer {
  private readonly running = new Set<Promise<void>>();

  constructor(private readonly log: Pick<Logger, 'error'>) {}

  /** Starts `work` on the next turn of the event loop, after the route has written its answer. */
  start(name: string, work: () => Promise<void>): void {
    const p: Promise<void> = new Promise<void>((resolve) => setImmediate(resolve))
      .then(work)
      .catch((err: unknown) => this.log.error({ err, work: name }, 'work after the answer failed'))
      .finally(() => this.running.delete(p));
    this.running.add(p);
  }

  /** Resolves when every started piece of work has finished. */
  async settled(): Promise<void> {
    while (this.running.size) await Promise.all([...this.running]);
  }
}
