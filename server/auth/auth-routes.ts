import { Router, type Request } from 'express';
import { csrfTokenFor } from '../platform/csrf';
import { requireSignedIn } from '../platform/require-role';
import { parse } from '../platform/validate';
import type { SessionUser } from '../platform/roles';
import type { AuthService } from './auth-service';
import {
  LoginBody,
  PasswordResetConfirmBody,
  PasswordResetRequestBody,
  RegisterBody,
  TokenBody,
} from '../../contracts/account/account-schemas';

/** What every accepted registration answers, whether the address is new or not. */
export const REGISTERED =
  'Check your inbox: we sent a message to that address. Follow it to confirm the address, then sign in.';

/** Starts a fresh session for the user; passport's login regenerates the id (ASVS 4.0.3 3.2.1). */
function signIn(req: Request, user: SessionUser): Promise<void> {
  return new Promise((resolve, reject) => req.login(user, (err) => (err ? reject(err) : resolve())));
}

/** Registration, sign-in and sign-out, verification and password reset under /api/auth. */
export function authRoutes(auth: AuthService): Router {
  const r = Router();

  r.get('/csrf', function csrf(req, res) {
    res.json({ csrfToken: csrfTokenFor(req) });
  });

  // The same answer for a new address and one that has an account (OWASP Authentication Cheat Sheet, account enumeration):
  // nobody is signed in here; the owner of the mailbox confirms it, then signs in.
  r.post('/register', async function register(req, res) {
    const body = parse(RegisterBody, req.body);
    await auth.register(body, req.ip ?? 'unknown');
    res.status(202).json({ queued: true, message: REGISTERED });
  });

  r.post('/login', async function login(req, res) {
    const body = parse(LoginBody, req.body);
    const user = await auth.authenticate(body.email, body.password, req.ip ?? 'unknown');
    await signIn(req, user);
    res.json({ user });
  });

  r.post('/logout', function logout(req, res, next) {
    // ASVS 4.0.3 3.3.1: the session is destroyed on the server, not just forgotten by the browser.
    req.logout({ keepSessionInfo: false }, (err) => {
      if (err) return next(err);
      req.session.destroy((destroyErr) => {
        if (destroyErr) return next(destroyErr);
        res.clearCookie('padside.sid');
        res.status(204).end();
      });
    });
  });

  // A visitor is not an error: `{user: null}` with 200, so a browser logs no failed request on every page load.
  r.get('/me', function me(req, res) {
    res.json({ user: req.user ?? null });
  });

  r.post('/verify', async function verify(req, res) {
    const { token } = parse(TokenBody, req.body);
    await auth.verifyEmail(token);
    res.status(204).end();
  });

  r.post('/verify/resend', requireSignedIn, async function resend(req, res) {
    await auth.resendVerification(req.user!.id, req.ip ?? 'unknown');
    res.status(202).json({ queued: true });
  });

  r.post('/password-reset', async function requestReset(req, res) {
    const { email } = parse(PasswordResetRequestBody, req.body);
    auth.requestPasswordReset(email);
    res.status(202).json({ queued: true });
  });

  r.post('/password-reset/confirm', async function confirmReset(req, res) {
    const body = parse(PasswordResetConfirmBody, req.body);
    await auth.confirmPasswordReset(body.token, body.password);
    res.status(204).end();
  });

  return r;
}
