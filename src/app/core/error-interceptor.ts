import { HttpContextToken, HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { isPlatformBrowser } from '@angular/common';
import { Injector, PLATFORM_ID, inject } from '@angular/core';
import { catchError, throwError } from 'rxjs';
import { apiErrorMessage } from './api-error';
import { CsrfToken } from './csrf-token';

/** Set on a request whose caller shows its own errors (forms put them beside the fields). */
export const QUIET_ERRORS = new HttpContextToken<boolean>(() => false);

/**
 * Shows API failures in a snack bar unless the caller handles them; a stale CSRF token is dropped. The snack bar's
 * code (and the overlay under it) is loaded on the first failure, so no page's first paint waits for it. Only the
 * browser shows one: a server-rendered page shows its own error state, and the loaded code would arrive after the render.
 */
export const errorInterceptor: HttpInterceptorFn = (req, next) => {
  const injector = inject(Injector);
  const inBrowser = isPlatformBrowser(inject(PLATFORM_ID));
  const csrf = inject(CsrfToken);
  return next(req).pipe(
    catchError((err: unknown) => {
      if (err instanceof HttpErrorResponse) {
        if (err.error?.error?.code === 'csrf_failed') csrf.forget();
        if (inBrowser && !req.context.get(QUIET_ERRORS)) {
          const message = apiErrorMessage(err);
          void import('@angular/material/snack-bar').then((m) =>
            injector.get(m.MatSnackBar).open(message, 'Dismiss', { duration: 6000 }),
          );
        }
      }
      return throwError(() => err);
    }),
  );
};
