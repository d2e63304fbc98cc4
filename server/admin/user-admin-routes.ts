import { Router } from 'express';
import { z } from 'zod';
import type { SignInGuard } from '../auth/sign-in-guard';
import type { UserRepository } from '../auth/user-repository';
import { notFound } from '../platform/app-error';
import { requireRole } from '../platform/require-role';
import { ROLES } from '../platform/roles';
import { fields, parse } from '../platform/validate';
import { adminView, type AccountAdminService } from './account-admin-service';

const ListQuery = z.object({
  q: z.string().trim().max(100).optional(),
  role: z.enum(ROLES).optional(),
  state: z.enum(['active', 'disabled'], { error: 'State is active or disabled.' }).optional(),
  page: fields.page,
  pageSize: fields.pageSize,
});
const RolesBody = z.object({
  roles: z
    .array(z.enum(ROLES, { error: `Roles are ${ROLES.join(', ')}.` }), { error: 'Send a list of roles.' })
    .max(ROLES.length),
});

/** Accounts, their roles, disabling, their history and their sign-in locks under /api/admin/users (admin only). */
export function userAdminRoutes(users: UserRepository, signIn: SignInGuard, accounts: AccountAdminService): Router {
  const r = Router();
  r.use(requireRole('admin'));

  r.get('/', async function listUsers(req, res) {
    const q = parse(ListQuery, req.query);
    const { items, total } = await users.page({
      ...q,
      disabled: q.state === undefined ? undefined : q.state === 'disabled',
    });
    const locks = await signIn.states(items.map((u) => u.email));
    res.json({
      items: items.map((u) => ({
        ...adminView(u),
        createdAt: u.created_at,
        signIn: locks.get(u.email) ?? { failures: 0, locked: false },
      })),
      total,
      page: q.page,
      pageSize: q.pageSize,
    });
  });

  r.patch('/:id', async function setRoles(req, res) {
    const { roles } = parse(RolesBody, req.body);
    res.json({ user: await accounts.setRoles(req.user!.id, parse(fields.id, req.params.id), roles) });
  });

  r.get('/:id/history', async function accountHistory(req, res) {
    res.json({ items: await accounts.history(parse(fields.id, req.params.id)) });
  });

  r.post('/:id/disable', async function disableAccount(req, res) {
    res.json({ user: await accounts.disable(req.user!.id, parse(fields.id, req.params.id)) });
  });

  r.post('/:id/enable', async function enableAccount(req, res) {
    res.json({ user: await accounts.enable(req.user!.id, parse(fields.id, req.params.id)) });
  });

  // Staff lift a lock once they know the owner is the one signing in (or the owner resets the password themselves).
  r.delete('/:id/sign-in-lock', async function clearSignInLock(req, res) {
    const row = await users.byId(parse(fields.id, req.params.id));
    if (!row) throw notFound('No such user.');
    await signIn.clear(row.email);
    res.status(204).end();
  });

  return r;
}
