import { randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler } from 'express';
import { AppError } from './app-error';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/** The session's token, created on first use (synchroniser-token pattern, OWASP CSRF cheat sheet). */
export function csrfTokenFor(req: Request): string {
  req.session.csrfToken ??= randomBytes(32).toString('base64url');
  return req.session.csrfToken;
}

/** Refuses unsafe methods without the session's token in `X-CSRF-Token`; `exempt` paths verify their own signatures. */
export function csrfProtection(exempt: string[]): RequestHandler {
  return (req, _res, next) => {
    if (SAFE.has(req.method) || exempt.includes(req.path)) return next();
    const sent = req.get('x-csrf-token') ?? '';
    const expected = req.session?.csrfToken ?? '';
    const ok =
      sent.length > 0 && sent.length === expected.length && timingSafeEqual(Buffer.from(sent), Buffer.from(expected));
    next(ok ? undefined : new AppError(403, 'csrf_failed', 'The form expired. Reload the page and try again.'));
  };
}
