import type { Socket } from 'node:net';
import path from 'node:path';
import type { RequestHandler } from 'express';
import type { PageRenderer } from './page-renderer';

/**
 * Where the server render reaches the API: the very address and port that accepted this request. The Host header is
 * the visitor's to choose, so it never decides where the server sends its own requests.
 */
export function loopbackOrigin(socket: Socket): string {
  const address = (socket.localAddress ?? '127.0.0.1').replace(/^::ffff:/, '');
  return `http://${address.includes(':') ? `[${address}]` : address}:${socket.localPort}`;
}

/** Headers of the render that Express writes itself (length, encoding) or that the app sets elsewhere. */
const SKIPPED_HEADERS = new Set([
  'content-length',
  'content-encoding',
  'transfer-encoding',
  'connection',
  'cache-control',
]);

/**
 * Every page address: the server-rendered page (public pages, as a visitor) or the client-rendered shell (personal
 * pages), with the status the render chose (404 for a product or post that does not exist). If the render fails the
 * shell goes out instead, so the page still works once its script runs.
 */
export function pageRoutes(renderer: PageRenderer | null, browserDist: string, publicUrl: string): RequestHandler {
  const shell = path.join(browserDist, 'index.csr.html');
  return async function renderPage(req, res) {
    res.setHeader('Cache-Control', 'private, no-cache');
    if (renderer) {
      try {
        const page = await renderer.render(publicUrl + req.originalUrl, {
          nonce: res.locals.cspNonce as string,
          apiOrigin: loopbackOrigin(req.socket),
        });
        if (page.status) {
          for (const [name, value] of page.headers)
            if (!SKIPPED_HEADERS.has(name.toLowerCase())) res.setHeader(name, value);
          res.status(page.status).send(page.body);
          return;
        }
      } catch (err) {
        req.log?.error({ err }, 'server render failed; sent the client-rendered page');
      }
    }
    res.sendFile(shell);
  };
}
