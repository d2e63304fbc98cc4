/** The admins' account-list query and roles body (/api/admin/users): the server parses with them; the console takes
 * their types. */
import { z } from 'zod';
import { fields } from '../forms/fields';
import { ROLES } from '../labels/roles';

/** GET /api/admin/users: words, role and state filters and the page. */
export const AccountListQuerySchema = z.object({
  q: z.string().trim().max(100).optional(),
  role: z.enum(ROLES).optional(),
  state: z.enum(['active', 'disabled'], { error: 'State is active or disabled.' }).optional(),
  page: fields.page,
  pageSize: fields.pageSize,
});

/** PATCH /api/admin/users/:id: the account's roles, replacing the ones it has. */
export const RolesBody = z.object({
  roles: z
    .array(z.enum(ROLES, { error: `Roles are ${ROLES.join(', ')}.` }), { error: 'Send a list of roles.' })
    .max(ROLES.length),
});

/** The accounts list's filters and page, as parsed (and as the console sends them). */
export type AccountListQuery = z.infer<typeof AccountListQuerySchema>;
/** A roles change as the console sends it. */
export type RolesInput = z.input<typeof RolesBody>;
