import { Router } from 'express';
import { requireRole } from '../platform/require-role';
import { fields, parse } from '../platform/validate';
import type { AccountAdminService } from './account-admin-service';
import { AccountListQuerySchema, RolesBody } from '../../contracts/account/account-admin-schemas';

/** Accounts, their roles, disabling, their history and their sign-in locks under /api/admin/users (admin only). */
export function userAdminRoutes(accounts: AccountAdminService): Router {
  const r = Router();
  r.use(requireRole('admin'));

  r.get('/', async function listUsers(req, res) {
    res.json(await accounts.list(parse(AccountListQuerySchema, req.query)));
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
    await accounts.clearSignInLock(parse(fields.id, req.params.id));
    res.status(204).end();
  });

  return r;
}
