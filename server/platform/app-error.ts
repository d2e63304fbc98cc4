/** Field name -> message, shown next to the matching form field. */
export type FieldErrors = Record<string, string>;

/** The one error type the API answers with; anything else is a defect and answers 500. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: FieldErrors,
    readonly headers?: Record<string, string>,
  ) {
    super(message);
  }
}

export const badRequest = (message: string, fields?: FieldErrors) =>
  new AppError(400, 'invalid_request', message, fields);
export const unauthorized = (message = 'Sign in to continue.') => new AppError(401, 'unauthenticated', message);
export const forbidden = (message = 'Your account does not have access to this.') =>
  new AppError(403, 'forbidden', message);
export const notFound = (message = 'Not found.') => new AppError(404, 'not_found', message);
export const conflict = (code: string, message: string, fields?: FieldErrors) =>
  new AppError(409, code, message, fields);
export const tooManyRequests = (retryAfterSeconds: number) =>
  new AppError(
    429,
    'rate_limited',
    `Too many attempts. Try again in ${Math.ceil(retryAfterSeconds / 60)} minute(s).`,
    undefined,
    {
      'Retry-After': String(Math.max(1, Math.ceil(retryAfterSeconds))),
    },
  );
