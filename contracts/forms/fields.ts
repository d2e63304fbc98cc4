import { z } from 'zod';

/** Common field schemas, so every form words its errors the same way. */
export const fields = {
  email: z
    .string({ error: 'E-mail is required.' })
    .trim()
    .toLowerCase()
    .max(254, 'E-mail is too long.')
    .pipe(z.email({ error: 'Enter a valid e-mail address.' })),
  id: z.coerce.number({ error: 'Must be a number.' }).int('Must be a whole number.').positive('Must be positive.'),
  // A real calendar day: 2026-02-30 would roll over to March 2 in Date, so the round trip must give the same text back.
  date: z
    .string({ error: 'Enter a date.' })
    .regex(/^\d{4}-\d{2}-\d{2}$/, 'Use the form YYYY-MM-DD.')
    .refine((s) => {
      const d = new Date(s + 'T00:00:00Z');
      return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === s;
    }, 'Not a real date.'),
  page: z.coerce.number().int().min(1).max(100000).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(25),
  cents: z
    .number({ error: 'Enter an amount in cents.' })
    .int('Amounts are whole cents.')
    .min(0, 'Cannot be negative.')
    .max(100_000_000),
  // A file the upload endpoint stored, referenced by its own path (or nothing).
  uploadedImage: z
    .string()
    .regex(/^\/uploads\/[a-z0-9-]+\.(jpg|png|webp|gif)$/, 'Upload the image first, then use the address it returns.')
    .nullish()
    .transform((s) => s ?? null),
  // The one rule for a card token sent by the browser, for dues and the shop alike: the processor's single-use tokens
  // (and its published test tokens) are short runs of letters, digits, `_`, `|` and `-`; anything else never reaches
  // the processor.
  cardToken: z
    .string({ error: 'Choose a card.' })
    .trim()
    .min(3, 'Choose a card.')
    .max(200, 'Not a card token.')
    .regex(/^[A-Za-z0-9_|-]+$/, 'Not a card token.'),
  /** Optional free text: blank becomes null, and a field left out stays undefined (a partial update keeps it). */
  optionalText: (max: number) =>
    z
      .string()
      .trim()
      .max(max, 'Too long.')
      .transform((v) => v || null)
      .nullish(),
};
