/** Bodies of the account routes (/api/account) and the password and e-mail-confirmation routes (/api/auth): the server
 * parses with them; the account pages take their types. */
import { z } from 'zod';
import { fields } from '../forms/fields';

/** PATCH /api/account/profile: only the fields sent change. */
export const ProfileBody = z
  .object({
    displayName: z.string().trim().min(1, 'Name is required.').max(80, 'Use at most 80 characters.').optional(),
    marketingOptOut: z.boolean().optional(),
  })
  .strict();

/** A profile change as the page sends it. */
export type ProfileInput = z.input<typeof ProfileBody>;

/** The password policy's length bounds, in characters (the server checks them, with its blocklist, in password-policy.ts). */
export const PASSWORD_MIN = 12;
export const PASSWORD_MAX = 128;

// Bodies only cap what they carry at four times the policy's length: the policy itself gives the message for too long.
const password = z
  .string({ error: 'Password is required.' })
  .min(1, 'Password is required.')
  .max(PASSWORD_MAX * 4, 'Password is too long.');

/** POST /api/auth/register: the answer is the same for a new address and a taken one. */
export const RegisterBody = z.object({
  email: fields.email,
  password,
  displayName: z
    .string({ error: 'Name is required.' })
    .trim()
    .min(1, 'Name is required.')
    .max(80, 'Use at most 80 characters.'),
});

/** POST /api/auth/login. */
export const LoginBody = z.object({ email: fields.email, password });

/** POST /api/auth/verify: the token from the confirmation link. */
export const TokenBody = z.object({
  token: z.string({ error: 'The link is incomplete.' }).min(10, 'The link is incomplete.').max(200),
});

/** POST /api/auth/password-reset: the address to send the reset link to. */
export const PasswordResetRequestBody = z.object({ email: fields.email });

/** POST /api/auth/password-reset/confirm: the token from the reset e-mail and the new password. */
export const PasswordResetConfirmBody = TokenBody.extend({ password });

/** POST /api/account/password: the current password, checked, and the new one. */
export const PasswordChangeBody = z.object({
  currentPassword: z
    .string({ error: 'Enter your current password.' })
    .min(1, 'Enter your current password.')
    .max(PASSWORD_MAX * 4),
  newPassword: z
    .string({ error: 'Enter a new password.' })
    .min(1, 'Enter a new password.')
    .max(PASSWORD_MAX * 4, 'Password is too long.'),
});

/** POST /api/account/delete: the password, to confirm it is the owner deleting the account. */
export const DeleteAccountBody = z.object({
  password: z
    .string({ error: 'Enter your password.' })
    .min(1, 'Enter your password.')
    .max(PASSWORD_MAX * 4, 'Password is too long.'),
});

/** A registration as the page sends it. */
export type RegisterInput = z.input<typeof RegisterBody>;
/** A sign-in as the page sends it. */
export type LoginInput = z.input<typeof LoginBody>;
/** A password reset as the page sends it. */
export type PasswordResetConfirmInput = z.input<typeof PasswordResetConfirmBody>;
/** A password change as the page sends it. */
export type PasswordChangeInput = z.input<typeof PasswordChangeBody>;
/** An account deletion as the dialog sends it. */
export type DeleteAccountInput = z.input<typeof DeleteAccountBody>;
/** A reset-link request. */
export type PasswordResetRequestInput = z.input<typeof PasswordResetRequestBody>;
/** An e-mail confirmation. */
export type TokenInput = z.input<typeof TokenBody>;
