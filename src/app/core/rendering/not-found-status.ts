import { HttpErrorResponse } from '@angular/common/http';
import { RESPONSE_INIT, inject } from '@angular/core';

/**
 * For a page whose record the API did not find: returns a function that, given the load error, makes the server
 * render answer 404 like the API did (in the browser there is no response to set, and it does nothing).
 */
export function notFoundStatus(): (error: unknown) => void {
  const response = inject(RESPONSE_INIT, { optional: true });
  return (error) => {
    if (response && error instanceof HttpErrorResponse && error.status === 404) response.status = 404;
  };
}
