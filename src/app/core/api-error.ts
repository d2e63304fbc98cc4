import { HttpErrorResponse } from '@angular/common/http';
import { AbstractControl, FormGroup } from '@angular/forms';
import type { ApiErrorBody } from './user';

/** The human message of an API failure. */
export function apiErrorMessage(err: unknown): string {
  if (err instanceof HttpErrorResponse) {
    const body = err.error as ApiErrorBody | null;
    if (body?.error?.message) return body.error.message;
    if (err.status === 0) return 'Padside cannot be reached. Check your connection and try again.';
    return `The request failed (${err.status}).`;
  }
  return 'Something went wrong.';
}

/**
 * Puts the server's per-field messages on the matching form controls (as the `server` error)
 * and returns the overall message for the form's banner. `rename` maps an API field to the control that
 * edits it where the two differ (a price typed in dollars that the API takes as `priceCents`).
 */
export function applyServerErrors(form: FormGroup, err: unknown, rename: Record<string, string> = {}): string {
  const fields = err instanceof HttpErrorResponse ? (err.error as ApiErrorBody | null)?.error?.fields : undefined;
  for (const [name, message] of Object.entries(fields ?? {})) {
    const control: AbstractControl | null = form.get(rename[name] ?? name);
    if (control) {
      control.setErrors({ ...(control.errors ?? {}), server: message });
      control.markAsTouched();
    }
  }
  return apiErrorMessage(err);
}
