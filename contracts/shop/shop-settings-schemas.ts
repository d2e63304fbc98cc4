/** GET and PUT /api/admin/shop/settings: the shop's tax position, discount, printer rules and carrier. The server
 * parses the PUT body with it and stores and answers what it parsed; the console edits the same fields. */
import { z } from 'zod';
import { PROVINCES } from './provinces';

const Province = z.enum(PROVINCES, { error: 'Choose a province or territory.' });

export const ShopSettingsSchema = z.object({
  sellerProvince: Province,
  /** The seller's legal or trading name on receipts; empty = the team's name. */
  sellerName: z.string().trim().max(120, 'At most 120 characters.'),
  gstHstNumber: z
    .string()
    .trim()
    .max(30, 'At most 30 characters.')
    .regex(/^(\d{9} ?RT ?\d{4})?$/, 'A business number: nine digits, RT and four digits, such as 123456789 RT0001.'),
  /** Provincial sales tax account numbers, printed on receipts that charge that province's tax. */
  provincialTaxNumbers: z.partialRecord(Province, z.string().trim().max(30, 'At most 30 characters.')),
  gstHstRegistered: z.boolean(),
  provincialRegistrations: z.array(Province).max(PROVINCES.length),
  provincialTaxOnShipping: z.partialRecord(Province, z.boolean()),
  memberDiscountPercent: z
    .number({ error: 'Enter a percentage.' })
    .int('Whole percent only.')
    .min(0, 'At least 0.')
    .max(90, 'At most 90.'),
  sparesPercent: z
    .number({ error: 'Enter a percentage.' })
    .int('Whole percent only.')
    .min(0, 'At least 0.')
    .max(100, 'At most 100.'),
  packMultiple: z
    .number({ error: 'Enter a number.' })
    .int('Whole pieces only.')
    .min(1, 'At least 1.')
    .max(500, 'At most 500.'),
  minimumPerDesign: z
    .number({ error: 'Enter a number.' })
    .int('Whole pieces only.')
    .min(0, 'At least 0.')
    .max(5000, 'At most 5000.'),
  /** Where staff notices (disputes) go. */
  staffEmail: z
    .string()
    .trim()
    .max(254)
    .pipe(z.email({ error: 'Enter a valid e-mail address.' })),
  /** The carrier the ship form starts with; empty = staff type it each time. */
  carrier: z.string().trim().max(60, 'At most 60 characters.').default(''),
});

export type ShopSettings = z.infer<typeof ShopSettingsSchema>;
/** The settings as staff send them (the carrier may be left out). */
export type ShopSettingsInput = z.input<typeof ShopSettingsSchema>;
