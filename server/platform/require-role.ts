import type { RequestHandler } from 'express';
import { forbidden, unauthorized } from './app-error';
import type { Role } from './roles';

/** Anonymous callers get 401. */
export const requireSignedIn: RequestHandler = (req, _res, next) => {
  next(req.user ? undefined : unauthorized());
};

/** Anonymous callers get 401; signed-in callers without one of the roles get 403. */
export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(unauthorized());
    if (!req.user.roles.some((r) => roles.includes(r))) return next(forbidden());
    next();
  };
}
