/**
 * The server bundle's entry: a worker thread that the Express app (`server/ssr/page-renderer.ts`) starts and sends
 * each public page request to. Angular renders it as a visitor and the answer goes back whole; Express writes it.
 */
import { AngularNodeAppEngine } from '@angular/ssr/node';
import { parentPort, workerData } from 'node:worker_threads';
import type { RenderContext } from './app/core/rendering/render-context';

/** One page to render, as the Express app sends it. */
interface RenderRequest {
  id: number;
  url: string;
  context: RenderContext;
}

/** The rendered answer; `status: 0` when Angular has no page for the address. */
type RenderAnswer =
  { id: number; status: number; headers: [string, string][]; body: string } | { id: number; error: string };

const engine = new AngularNodeAppEngine({
  allowedHosts: (workerData as { allowedHosts?: string[] } | null)?.allowedHosts ?? [],
});

/**
 * Gives every script element of the page this response's nonce (the build's own inline event-replay contract too),
 * and the root element `ngCspNonce`, from which the browser app takes the nonce for what it inlines later.
 */
export function withNonce(html: string, nonce: string): string {
  return html
    .replace(/<script\b(?![^>]*\snonce=)/g, `<script nonce="${nonce}"`)
    .replace(/<ps-root\b(?![^>]*\sngcspnonce=)/i, `<ps-root ngCspNonce="${nonce}"`);
}

async function render({ id, url, context }: RenderRequest): Promise<RenderAnswer> {
  try {
    // No cookie and no other header of the visitor's: the page is the same for everyone.
    const response = await engine.handle(new Request(url, { headers: { accept: 'text/html' } }), context);
    if (!response) return { id, status: 0, headers: [], body: '' };
    const headers: [string, string][] = [];
    response.headers.forEach((value, name) => headers.push([name, value]));
    return { id, status: response.status, headers, body: withNonce(await response.text(), context.nonce) };
  } catch (e) {
    return { id, error: e instanceof Error ? (e.stack ?? e.message) : String(e) };
  }
}

parentPort?.on('message', (message: RenderRequest) => {
  void render(message).then((answer) => parentPort!.postMessage(answer));
});
