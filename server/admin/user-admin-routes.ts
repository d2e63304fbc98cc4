import { Router } from 'express';
import { z } from 'zod';
import type { SignInGuard } from '../auth/sign-in-guard';
import type { UserRepository } from '../auth/user-repository';
import { toSessionUser } from '../auth/user-repository';
import { badRequest, conflict, notFound } from '../platform/app-error';
import { requireRole } from '../platform/require-role';
import { ROLES } from '../platform/roles';
import { fields, parse } from '../platform/validate';

const ListQuery = z.object({ q: z.string().trim().max(100).optional(), role: z.enum(ROLES).optional(), page: fields.page, pageSize: fields.pageSize });
const RolesBody = z.object({
  roles: z.array(z.enum(ROLES, { error: `Roles are ${ROLES.join(', ')}.` }), { error: 'Send a list of roles.' }).max(ROLES.length),
});

/** Accounts, their roles and their sign-in locks under /api/admin/users (admin only). */
export function userAdminRoutes(users: UserRepository, signIn: SignInGuard): Router {
  const r = Router();
  r.use(requireRole('admin'));

  r.get('/', async function listUsers(req, res) {
    const q = parse(ListQuery, req.query);
    const { items, total } = await users.page(q);
    const locks = await signIn.states(items.map((u) => u.email));
    res.json({ items: items.map((u) => ({ ...toSessionUser(u), createdAt: u.created_at, deletedAt: u.deleted_at, signIn: locks.get(u.email) ?? { failures: 0, locked: false } })), total, page: q.page, pageSize: q.pageSize });
  });

  r.patch('/:id', async function setRoles(req, res) {
    const id = parse(fields.id, req.params.id);
    const { roles } = parse(RolesBody, req.body);
    const unique = [...new Set(roles)];
    if (id === req.user!.id && !unique.includes('admin')) throw badRequest('You cannot remove your own admin role.', { roles: 'Keep admin on your own account.' });
    const before = await users.byId(id);
    if (!before) throw notFound('No such user.');
    if (before.deleted_at) throw conflict('account_deleted', 'This account was deleted by its owner; it cannot be given roles.');
    const row = await users.update(id, { roles: unique.length ? unique : ['fan'] });
    if (!row) throw notFound('No such user.');
    res.json({ user: toSessionUser(row) });
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
