import { HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { switchMap } from 'rxjs';
import { CsrfToken } from './csrf-token';

const UNSAFE = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/** Adds `X-CSRF-Token` to every state-changing call to our own API. */
export const csrfInterceptor: HttpInterceptorFn = (req, next) => {
  if (!UNSAFE.has(req.method) || !req.url.startsWith('/api/')) return next(req);
  return inject(CsrfToken)
    .get()
    .pipe(switchMap((token) => next(req.clone({ setHeaders: { 'X-CSRF-Token': token } }))));
};
