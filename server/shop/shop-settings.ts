import { z } from 'zod';
import { defineSetting } from '../settings/settings-service';
import { PROVINCES } from './tax';

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

/**
 * The shop's tax position, discount and printer rules. Defaults are the demo seller: Manitoba, registered for
 * GST/HST and Manitoba RST only, 10% member discount. Provincial tax on shipping: from memory (Manitoba RST and
 * Quebec QST on delivery charged by the seller; B.C. and Saskatchewan likewise): confirm with each province.
 * Spares 5%, packs of 6 and 12 pieces a design: common practice, no source. Seller name and registration numbers
 * start empty (receipts then name the team and print no number); the demo seed fills in invented ones. The carrier
 * starts empty: Padside names no shipping company.
 */
export const SHOP_SETTINGS = defineSetting<ShopSettings>('shop', ShopSettingsSchema, {
  sellerProvince: 'MB',
  sellerName: '',
  gstHstNumber: '',
  provincialTaxNumbers: {},
  gstHstRegistered: true,
  provincialRegistrations: ['MB'],
  provincialTaxOnShipping: { MB: true, QC: true, BC: true, SK: true },
  memberDiscountPercent: 10,
  sparesPercent: 5,
  packMultiple: 6,
  minimumPerDesign: 12,
  staffEmail: 'treasurer@padside.test',
  carrier: '',
});
