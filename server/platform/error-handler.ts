import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { ApiErrorBody } from '../../contracts/forms/error-answer';
import { AppError } from './app-error';
import { isDatabaseUnavailable } from './database-unavailable';

/** Seconds a caller should wait after the database went away; a restart takes about a second (common practice, no source). */
export const DATABASE_RETRY_AFTER_SECONDS = 5;

/** JSON 404 for unknown API paths. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new AppError(404, 'not_found', `No API route for ${req.method} ${req.path}.`));
};

/** The error answer, typed by the contract the app reads. */
const errorBody = (error: ApiErrorBody['error']): ApiErrorBody => ({ error });

interface HttpishError {
  status?: number;
  statusCode?: number;
  type?: string;
  expose?: boolean;
  code?: string;
}

/**
 * The single error handler: AppError and body-parser errors answer as they are, a lost or refused database connection
 * 503 with Retry-After, anything else 500 without details.
 */
export const errorHandler: ErrorRequestHandler = (err: unknown, req, res, _next) => {
  if (err instanceof AppError) {
    if (err.headers) res.set(err.headers);
    res
      .status(err.status)
      .json(errorBody({ code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}) }));
    return;
  }
  const e = (err ?? {}) as HttpishError;
  const status = e.status ?? e.statusCode;
  if (status && status >= 400 && status < 500 && e.expose !== false) {
    const messages: Record<string, string> = {
      'entity.parse.failed': 'The request body is not valid JSON.',
      'entity.too.large': 'The request body is too large.',
      'encoding.unsupported': 'The request body encoding is not supported.',
      'charset.unsupported': 'The request body charset is not supported.',
    };
    res.status(status).json(
      errorBody({
        code: (e.type ?? 'bad_request').replace(/\./g, '_'),
        message: messages[e.type ?? ''] ?? 'The request could not be read.',
      }),
    );
    return;
  }
  if (isDatabaseUnavailable(err)) {
    req.log?.warn({ err }, 'database unavailable');
    res.set('Retry-After', String(DATABASE_RETRY_AFTER_SECONDS));
    res.status(503).json(
      errorBody({
        code: 'database_unavailable',
        message: 'Padside cannot reach its database just now. Please try again in a few seconds.',
      }),
    );
    return;
  }
  req.log?.error({ err }, 'unhandled error');
  res.status(500).json(
    errorBody({
      code: 'internal',
      message: 'Something went wrong on our side. It has been logged; please try again.',
    }),
  );
};
