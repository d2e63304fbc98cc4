import { Router } from 'express';
import { z } from 'zod';
import type { AuthService } from '../auth/auth-service';
import { PASSWORD_MAX } from '../auth/password-policy';
import { requireSignedIn } from '../platform/require-role';
import { parse } from '../platform/validate';

const ProfileBody = z
  .object({
    displayName: z.string().trim().min(1, 'Name is required.').max(80, 'Use at most 80 characters.').optional(),
    marketingOptOut: z.boolean().optional(),
  })
  .strict();
const PasswordBody = z.object({
  currentPassword: z.string({ error: 'Enter your current password.' }).min(1, 'Enter your current password.').max(PASSWORD_MAX * 4),
  newPassword: z.string({ error: 'Enter a new password.' }).min(1, 'Enter a new password.').max(PASSWORD_MAX * 4, 'Password is too long.'),
});

/** The signed-in user's own profile and password under /api/account. */
export function accountRoutes(auth: AuthService): Router {
  const r = Router();
  r.use(requireSignedIn);

  r.get('/profile', async function profile(req, res) {
    const row = await auth.users.byId(req.user!.id);
    res.json({ user: req.user, marketingOptOut: row?.marketing_opt_out ?? false });
  });

  r.patch('/profile', async function updateProfile(req, res) {
    const body = parse(ProfileBody, req.body);
    const user = await auth.updateProfile(req.user!.id, body);
    res.json({ user, marketingOptOut: body.marketingOptOut });
  });

  r.post('/password', async function changePassword(req, res) {
    const body = parse(PasswordBody, req.body);
    await auth.changePassword(req.user!.id, body.currentPassword, body.newPassword, req.sessionID);
    res.status(204).end();
  });

  return r;
}
