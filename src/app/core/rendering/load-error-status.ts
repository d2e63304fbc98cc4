import { HttpErrorResponse } from '@angular/common/http';
import { RESPONSE_INIT, inject } from '@angular/core';

/** True when the API answered that the record does not exist (not that it could not answer). */
export function isNotFound(error: unknown): boolean {
  return error instanceof HttpErrorResponse && error.status === 404;
}

/**
 * For a page whose load can fail either way: returns a function that, given the load error, makes the server render
 * answer 404 when the record does not exist and 503 when the API could not answer (5xx, no connection), so a crawler
 * comes back later instead of dropping the page. In the browser there is no response to set, and it does nothing.
 */
export function loadErrorStatus(): (error: unknown) => void {
  const response = inject(RESPONSE_INIT, { optional: true });
  return (error) => {
    if (response && error) response.status = isNotFound(error) ? 404 : 503;
  };
}
