import { REQUEST_CONTEXT, inject } from '@angular/core';

/** What the Express app hands each server render, beside the request itself. */
export interface RenderContext {
  /** This response's CSP nonce; every inline script the render writes carries it. */
  nonce: string;
  /** Where the server render reaches the API: the address and port that accepted the request, never the Host header. */
  apiOrigin: string;
}

/** The render's context; null in the browser and while the build reads the routes. */
export function renderContext(): RenderContext | null {
  return inject(REQUEST_CONTEXT, { optional: true }) as RenderContext | null;
}
