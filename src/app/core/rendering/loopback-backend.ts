import {
  HttpBackend,
  HttpErrorResponse,
  HttpHeaders,
  type HttpEvent,
  type HttpRequest,
  HttpResponse,
} from '@angular/common/http';
import { Injectable } from '@angular/core';
import { Observable } from 'rxjs';
import { renderContext } from './render-context';

/**
 * The server render's HTTP: GET requests to Padside's own `/api` on the address that accepted the page request, with
 * no cookie and no session, so the render sees exactly what any visitor sees. Only the content type comes back as a
 * header: the answer is a visitor's, so it may travel inside the page as transfer state (the API's `no-store` is for
 * browsers that hold a session).
 */
@Injectable()
export class LoopbackBackend implements HttpBackend {
  private readonly context = renderContext();

  handle(req: HttpRequest<unknown>): Observable<HttpEvent<unknown>> {
    return new Observable((observer) => {
      // The relative-URL step has made the address absolute against the page's public origin; only the path counts.
      const target = new URL(req.urlWithParams, 'http://page.invalid');
      if (req.method !== 'GET' || !this.context || !target.pathname.startsWith('/api/')) {
        observer.error(new HttpErrorResponse({ status: 0, statusText: 'Not available while rendering', url: req.url }));
        return undefined;
      }
      const abort = new AbortController();
      fetch(this.context.apiOrigin + target.pathname + target.search, {
        headers: { accept: 'application/json' },
        signal: abort.signal,
      })
        .then(async (res) => {
          const text = await res.text();
          const headers = new HttpHeaders(
            res.headers.has('content-type') ? { 'content-type': res.headers.get('content-type')! } : {},
          );
          const body = req.responseType === 'json' && text ? (JSON.parse(text) as unknown) : text;
          if (res.ok) {
            observer.next(
              new HttpResponse({ body, headers, status: res.status, statusText: res.statusText, url: req.url }),
            );
            observer.complete();
          } else {
            observer.error(
              new HttpErrorResponse({
                error: body,
                headers,
                status: res.status,
                statusText: res.statusText,
                url: req.url,
              }),
            );
          }
        })
        .catch((error: unknown) =>
          observer.error(new HttpErrorResponse({ error, status: 0, statusText: 'Unknown Error', url: req.url })),
        );
      return () => abort.abort();
    });
  }
}
