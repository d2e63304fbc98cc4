import { HttpContextToken, HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { MatSnackBar } from '@angular/material/snack-bar';
import { catchError, throwError } from 'rxjs';
import { apiErrorMessage } from './api-error';
import { CsrfToken } from './csrf-token';

/** Set on a request whose caller shows its own errors (forms put them beside the fields). */
export const QUIET_ERRORS = new HttpContextToken<boolean>(() => false);

/** Shows API failures in a snack bar unless the caller handles them; a stale CSRF token is dropped. */
export const errorInterceptor: HttpInterceptorFn = (req, next) => {
  const snackBar = inject(MatSnackBar);
  const csrf = inject(CsrfToken);
  return next(req).pipe(
    catchError((err: unknown) => {
      if (err instanceof HttpErrorResponse) {
        if (err.error?.error?.code === 'csrf_failed') csrf.forget();
        if (!req.context.get(QUIET_ERRORS)) snackBar.open(apiErrorMessage(err), 'Dismiss', { duration: 6000 });
      }
      return throwError(() => err);
    }),
  );
};
