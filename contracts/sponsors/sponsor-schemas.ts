/** Bodies of the sponsor routes (/api/admin/sponsors): the server parses with them; the console takes their types. */
import { z } from 'zod';
import { fields } from '../forms/fields';
import { DELIVERABLE_KIND_LABELS, DELIVERABLE_KINDS } from '../labels/deliverable-kinds';
import { PROVINCES } from '../shop/provinces';
import { TAX_TREATMENTS } from './tax-treatments';

const optionalText = (max: number) =>
  z
    .string()
    .trim()
    .max(max, `Use at most ${max} characters.`)
    .nullish()
    .transform((s) => s || null);

/** An http(s) address, or nothing. */
export const webAddress = z
  .string()
  .trim()
  .max(300, 'Use at most 300 characters.')
  .refine(
    (s) => s === '' || /^https?:\/\/[^\s/$.?#][^\s]*$/i.test(s),
    'Enter an address starting with http:// or https://.',
  )
  .nullish()
  .transform((s) => s || null);

/** POST /api/admin/sponsors and PUT /api/admin/sponsors/:id. */
export const SponsorBody = z.object({
  name: z
    .string({ error: 'Name is required.' })
    .trim()
    .min(1, 'Name is required.')
    .max(120, 'Use at most 120 characters.'),
  website: webAddress,
  blurb: optionalText(1000),
  logoUrl: fields.uploadedImage,
});

const season = z.string({ error: 'Season is required.' }).regex(/^\d{4}$/, 'A season is a year, like 2026.');

const taxTreatment = z.enum(TAX_TREATMENTS, { error: 'Tax treatment is promotion or gift.' });
const province = z.enum(PROVINCES, { error: 'Choose a province or territory.' });

/** POST /api/admin/sponsors/:id/agreements. */
export const AgreementBody = z.object({
  season,
  taxTreatment: taxTreatment.optional(),
  taxProvince: province.nullish(),
  cashCents: fields.cents.optional(),
  note: optionalText(1000),
  inKind: z
    .array(
      z.object({
        description: z
          .string({ error: 'Describe the item.' })
          .trim()
          .min(1, 'Describe the item.')
          .max(200, 'Use at most 200 characters.'),
        valueCents: fields.cents,
        receivedOn: fields.date.nullish(),
      }),
    )
    .max(50)
    .optional(),
  deliverables: z
    .array(
      z.object({
        kind: z.enum(DELIVERABLE_KINDS, {
          error: `Choose a kind: ${DELIVERABLE_KINDS.map((k) => DELIVERABLE_KIND_LABELS[k].toLowerCase()).join(', ')}.`,
        }),
        quantity: z.number({ error: 'Enter a quantity.' }).int('Whole numbers only.').min(1, 'At least 1.').max(1000),
        dueOn: fields.date,
      }),
      {
        error: 'List what was promised.',
      },
    )
    .max(50),
});

/** POST /api/admin/sponsors/agreements/:agreementId/cash-received. */
export const CashReceivedBody = z.object({
  receivedOn: fields.date,
  method: z.enum(['cash', 'e-transfer', 'cheque', 'card', 'other'], {
    error: 'Choose e-transfer, cheque, cash, card or other.',
  }),
});

/** POST /api/admin/sponsors/:id/credits: a credit given by hand (build-log credits come from publishing). */
export const HandCreditBody = z
  .object({
    kind: z.enum(['video_mention', 'logo_on_merch', 'sponsors_page', 'social_post'], {
      error:
        'Build log credits come from publishing a post; pick a video mention, logo on merch, sponsors page listing or social post.',
    }),
    url: webAddress,
    videoTimestamp: z
      .string()
      .regex(/^\d{1,2}(:\d{2}){1,2}$/, 'Use minutes and seconds, like 4:35 or 1:04:35.')
      .nullish()
      .transform((s) => s ?? null),
    note: optionalText(500),
    creditedOn: fields.date.optional(),
  })
  .refine((c) => c.kind === 'logo_on_merch' || c.kind === 'sponsors_page' || c.url !== null, {
    path: ['url'],
    message: 'Add the link where the credit can be seen.',
  });

/** POST /api/admin/sponsors/:id/contacts: an account by id or by e-mail. */
export const ContactBody = z
  .object({ userId: fields.id.optional(), email: fields.email.optional() })
  .refine((c) => c.userId !== undefined || c.email !== undefined, {
    path: ['email'],
    message: 'Enter the contact’s e-mail.',
  });

/** PUT /api/admin/sponsors/agreements/:agreementId/tax-treatment. */
export const TaxTreatmentBody = z.object({ taxTreatment, province: province.nullish() });

/** One tier: a sponsor whose season total (cash + declared in-kind value) reaches `minCents` holds it. */
export interface Tier {
  name: string;
  minCents: number;
}

/** PUT /api/admin/sponsors/tiers (and what GET answers). */
export const TiersSchema = z.object({
  tiers: z
    .array(
      z.object({
        name: z.string().trim().min(1, 'Name the tier.').max(40, 'Use at most 40 characters.'),
        minCents: z.number().int('Whole cents.').min(0, 'Cannot be negative.').max(100_000_000),
      }),
    )
    .min(1, 'Keep at least one tier.')
    .max(8, 'At most 8 tiers.')
    .refine((ts) => new Set(ts.map((t) => t.minCents)).size === ts.length, 'Each tier needs its own threshold.')
    .refine((ts) => new Set(ts.map((t) => t.name.toLowerCase())).size === ts.length, 'Each tier needs its own name.'),
});

/** A sponsor as the console sends it. */
export type SponsorBodyInput = z.input<typeof SponsorBody>;
/** An agreement as the console sends it. */
export type AgreementBodyInput = z.input<typeof AgreementBody>;
/** The day and way an agreement's cash arrived. */
export type CashReceivedInput = z.input<typeof CashReceivedBody>;
export type CashMethod = CashReceivedInput['method'];
/** A credit recorded by hand, as the console sends it. */
export type HandCreditInput = z.input<typeof HandCreditBody>;
/** The kinds of credit staff record by hand. */
export type HandCreditKind = HandCreditInput['kind'];
/** A contact to link, as the console sends it. */
export type ContactInput = z.input<typeof ContactBody>;
/** An agreement's tax treatment, as the console sends it. */
export type TaxTreatmentInput = z.input<typeof TaxTreatmentBody>;
/** The sponsor tiers, as the console sends and gets them. */
export type Tiers = z.infer<typeof TiersSchema>;
