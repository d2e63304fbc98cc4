/** The treasurer's request bodies (plans, record edits, payments, refunds, verifications, check-in): the server parses with them; the console takes their types. */
import { z } from 'zod';
import { fields } from '../forms/fields';

const nullableDate = fields.date.nullable().or(z.literal('').transform(() => null));

// Without defaults, so a PATCH of one field leaves the others as they are.
/** PATCH /api/admin/members/plans/:id (as `.partial()`): what staff may change on a plan. */
export const PlanChangesSchema = z.object({
  name: z.string().trim().min(1, 'Name is required.').max(80),
  description: z.string().trim().max(400),
  duesCents: fields.cents,
  joiningFeeCents: fields.cents,
  active: z.boolean(),
  sortOrder: z.number().int().min(0).max(1000),
});

/** POST /api/admin/members/plans: a new plan; the code and who may hold it are fixed once members can hold it. */
export const NewPlanSchema = PlanChangesSchema.extend({
  code: z
    .string()
    .trim()
    .toLowerCase()
    .regex(/^[a-z0-9-]{2,32}$/, 'Use 2-32 lower-case letters, digits or dashes.'),
  eligibility: z.enum(['any', 'junior', 'family']).default('any'),
  description: PlanChangesSchema.shape.description.default(''),
  joiningFeeCents: fields.cents.default(0),
  active: z.boolean().default(true),
  sortOrder: PlanChangesSchema.shape.sortOrder.default(0),
});

/** PATCH /api/admin/members/:id: staff corrections of a member's record. */
export const MemberEditSchema = z.object({
  associationNumber: z.string().trim().max(40).nullable().optional(),
  associationExpires: nullableDate.optional(),
  certificationLevel: z.string().trim().max(16).optional(),
  certificationDate: nullableDate.optional(),
  address: z.string().trim().min(1).max(400).optional(),
  phone: z.string().trim().min(7).max(40).optional(),
  emergencyContact: z.string().trim().min(1).max(200).optional(),
});

/** POST /api/admin/members/:id/payments: dues paid in person, with its receipt number. */
export const ManualPaymentSchema = z.object({
  amountCents: fields.cents.refine((v) => v > 0, 'Enter the amount received.'),
  method: z.enum(['cash', 'e-transfer', 'cheque'], { error: 'Choose cash, e-transfer or cheque.' }),
  receiptNumber: z
    .string({ error: 'Receipt number is required.' })
    .trim()
    .min(1, 'Receipt number is required.')
    .max(40),
  note: z.string().trim().max(400).optional(),
});

/** POST /api/admin/members/:id/refunds: what the treasurer asks to refund. */
export const RefundSchema = z.object({
  paymentId: fields.id,
  amountCents: fields.cents,
  reason: z.string({ error: 'Give a reason.' }).trim().min(1, 'Give a reason.').max(400),
});

/** POST /api/check-in: the scanned or pasted member-card code. */
export const CheckInSchema = z.object({
  token: z.string({ error: 'Paste or scan a card code.' }).trim().min(1, 'Paste or scan a card code.').max(500),
});

/** Which self-entered part of a record staff check (a verification's `what`, and the withdraw route's `:what`). */
export const VerifiedPartSchema = z.enum(['association', 'certification'], {
  error: 'Choose the association membership or the certification.',
});

// The values staff saw come along, so a value the member changed meanwhile is not marked verified unseen.
/** POST /api/admin/members/:id/verifications: the document checked, and the values staff saw. */
export const VerifySchema = z.strictObject({
  what: VerifiedPartSchema,
  against: z
    .string({ error: 'Say what you checked it against.' })
    .trim()
    .min(3, 'Say what you checked it against (for example: association card, seen at the field).')
    .max(200, 'Use at most 200 characters.'),
  associationNumber: z.string().trim().max(40).nullish(),
  associationExpires: fields.date.nullish(),
  certificationLevel: z.string().trim().max(16).optional(),
});

/** Which self-entered part of a record staff check. */
export type VerifiedPart = z.infer<typeof VerifiedPartSchema>;
/** What staff may change on a plan. */
export type PlanChanges = z.infer<typeof PlanChangesSchema>;
/** A new plan as the console sends it (defaults fill what it leaves out). */
export type NewPlan = z.input<typeof NewPlanSchema>;
/** A new plan as parsed, every field filled. */
export type NewPlanInput = z.infer<typeof NewPlanSchema>;
/** Staff edits of a member's record, as parsed. */
export type MemberPatch = z.infer<typeof MemberEditSchema>;
/** A payment recorded by hand, as the console sends it. */
export type ManualPaymentRequest = z.input<typeof ManualPaymentSchema>;
/** A refund request, as parsed. */
export type RefundRequest = z.infer<typeof RefundSchema>;
/** What staff send to mark a claim checked. */
export type VerifyRequest = z.input<typeof VerifySchema>;
/** A verification as the server reads it. */
export type VerifyInput = z.infer<typeof VerifySchema>;
