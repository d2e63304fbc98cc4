/** Request bodies and queries of the member's dues routes: the server parses with them; the app takes their types. */
import { z } from 'zod';
import { fields } from '../forms/fields';

const text = (label: string, max: number) =>
  z
    .string({ error: `${label} is required.` })
    .trim()
    .min(1, `${label} is required.`)
    .max(max, `${label} is too long.`);
const optionalDate = fields.date.nullish().or(z.literal('').transform(() => null));

const ProfileSchema = z.object({
  legalName: text('Legal name', 120),
  dateOfBirth: fields.date,
  address: text('Address', 400),
  phone: text('Phone', 40).regex(/^[0-9+() .-]{7,40}$/, 'Enter a phone number (digits, spaces, + ( ) - .).'),
  emergencyContact: text('Emergency contact', 200),
  associationNumber: fields.optionalText(40),
  associationExpires: optionalDate,
  certificationLevel: z.string().trim().max(16).optional(),
  certificationDate: optionalDate,
  familyMembers: z
    .array(z.object({ name: text('Name', 120), dateOfBirth: fields.date }))
    .max(10, 'At most 10 family members.')
    .optional(),
});

/** POST /api/membership/join: the plan, the member's details, the waiver and safety code accepted, and the card. */
export const JoinBody = z.object({
  planId: fields.id,
  profile: ProfileSchema,
  waiverVersion: z.string({ error: 'Accept the waiver.' }).min(1, 'Accept the waiver.').max(32),
  safetyCodeVersion: z.string().max(32).optional(),
  paymentToken: fields.cardToken,
  autoRenew: z.boolean().optional(),
});

/** POST /api/membership/renew: the next term, with the card on file or a new one, and any changed claims. */
export const RenewBody = z.object({
  paymentToken: fields.cardToken.optional(),
  planId: fields.id.optional(),
  waiverVersion: z.string().max(32).optional(),
  safetyCodeVersion: z.string().max(32).optional(),
  profile: ProfileSchema.pick({
    associationNumber: true,
    associationExpires: true,
    certificationLevel: true,
    certificationDate: true,
  })
    .partial()
    .optional(),
});

/** GET /api/membership/quote: what a plan's dues come to (on a given day, for staff checks). */
export const DuesQuoteQuery = z.object({ planId: fields.id, on: fields.date.optional() });

// The member's own corrections between renewals: never the name or date of birth, which staff change.
export const ProfileEditBody = ProfileSchema.pick({
  address: true,
  phone: true,
  emergencyContact: true,
  associationNumber: true,
  associationExpires: true,
  certificationLevel: true,
  certificationDate: true,
}).partial();

/** POST /api/membership/auto-renew: automatic renewal on (with a card, unless one is on file) or off. */
export const AutoRenewBody = z.object({
  autoRenew: z.boolean({ error: 'Choose on or off.' }),
  paymentToken: fields.cardToken.optional(),
});

export type JoinInput = z.input<typeof JoinBody>;
export type RenewInput = z.input<typeof RenewBody>;
export type ProfileEditInput = z.input<typeof ProfileEditBody>;
export type AutoRenewInput = z.input<typeof AutoRenewBody>;
