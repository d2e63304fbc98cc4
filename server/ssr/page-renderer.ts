import { existsSync } from 'node:fs';
import path from 'node:path';
import { Worker } from 'node:worker_threads';

/** What the server render hands each page: this response's nonce and where to reach the API. */
export interface RenderContext {
  nonce: string;
  apiOrigin: string;
}

/** A rendered page; `status: 0` when the app has no page at that address. */
export interface RenderedPage {
  status: number;
  headers: [string, string][];
  body: string;
}

type Answer = ({ id: number } & RenderedPage) | { id: number; error: string };

/** A render that takes longer is given up and the client-rendered page sent instead (common practice, no source). */
const RENDER_TIMEOUT_MS = 15_000;

/**
 * Runs the Angular server bundle (`dist/padside/server/server.mjs`, see `src/server.ts`) in one worker thread of this
 * process, so rendering neither blocks the API's event loop nor needs a second server. The worker starts on the first
 * page and starts again after a crash; each page waits for its own answer.
 */
export class PageRenderer {
  private worker: Worker | null = null;
  private nextId = 1;
  private readonly waiting = new Map<number, { resolve(page: RenderedPage): void; reject(error: Error): void }>();

  constructor(
    private readonly entry: string,
    private readonly allowedHosts: string[],
  ) {}

  /** The renderer for a build whose browser files are in `browserDist`; null when the build has no server bundle. */
  static forBuild(browserDist: string, publicUrl: string): PageRenderer | null {
    const entry = path.join(path.dirname(browserDist), 'server', 'server.mjs');
    return existsSync(entry) ? new PageRenderer(entry, [new URL(publicUrl).hostname]) : null;
  }

  /** Renders one address in the worker; rejects after the time limit so the caller can send the client-rendered page. */
  render(url: string, context: RenderContext): Promise<RenderedPage> {
    const id = this.nextId++;
    const worker = this.start();
    return new Promise<RenderedPage>((resolve, reject) => {
      const timer = setTimeout(
        () => this.settle(id, new Error(`render of ${url} took over ${RENDER_TIMEOUT_MS} ms`)),
        RENDER_TIMEOUT_MS,
      );
      this.waiting.set(id, {
        resolve: (page) => (clearTimeout(timer), resolve(page)),
        reject: (error) => (clearTimeout(timer), reject(error)),
      });
      worker.postMessage({ id, url, context });
    });
  }

  /** Stops the worker thread at shutdown; a render after this would start a new one. */
  async close(): Promise<void> {
    const worker = this.worker;
    this.worker = null;
    await worker?.terminate();
  }

  private start(): Worker {
    if (this.worker) return this.worker;
    const worker = new Worker(this.entry, { workerData: { allowedHosts: this.allowedHosts } });
    worker.on('message', (answer: Answer) =>
      this.settle(answer.id, 'error' in answer ? new Error(answer.error) : answer),
    );
    const fail = (error: Error) => {
      if (this.worker === worker) this.worker = null;
      for (const id of [...this.waiting.keys()]) this.settle(id, error);
    };
    worker.on('error', fail);
    worker.on('exit', (code) => fail(new Error(`page render worker stopped (exit ${code})`)));
    // A waiting render keeps the process alive; an idle worker does not.
    worker.unref();
    this.worker = worker;
    return worker;
  }

  private settle(id: number, outcome: RenderedPage | Error): void {
    const waiter = this.waiting.get(id);
    if (!waiter) return;
    this.waiting.delete(id);
    if (outcome instanceof Error) waiter.reject(outcome);
    else waiter.resolve({ status: outcome.status, headers: outcome.headers, body: outcome.body });
  }
}
