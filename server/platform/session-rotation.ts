import type { RequestHandler } from 'express';

/**
 * Gives the session a new id when the signed-in user's roles changed since the last request (OWASP ASVS 4.0.3
 * 3.2.1 asks for a new session on authentication; a role change is a change of privilege too). The CSRF token is
 * carried over so an open form still submits.
 */
export const rotateSessionOnRoleChange: RequestHandler = (req, _res, next) => {
  if (!req.user) return next();
  const stamp = [...req.user.roles].sort().join(',');
  if (req.session.roleStamp === undefined) {
    req.session.roleStamp = stamp;
    return next();
  }
  if (req.session.roleStamp === stamp) return next();
  const csrfToken = req.session.csrfToken;
  // passport's login regenerates the session id.
  req.login(req.user, (err) => {
    if (err) return next(err);
    req.session.csrfToken = csrfToken;
    req.session.roleStamp = stamp;
    next();
  });
};
