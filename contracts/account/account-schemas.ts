/** Bodies of the account routes (/api/account): the server parses with them; the profile page takes their types. */
import { z } from 'zod';

/** PATCH /api/account/profile: only the fields sent change. */
export const ProfileBody = z
  .object({
    displayName: z.string().trim().min(1, 'Name is required.').max(80, 'Use at most 80 characters.').optional(),
    marketingOptOut: z.boolean().optional(),
  })
  .strict();

/** A profile change as the page sends it. */
export type ProfileInput = z.input<typeof ProfileBody>;
