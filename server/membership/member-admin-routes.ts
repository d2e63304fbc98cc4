import { Router } from 'express';
import { z } from 'zod';
import { fields, parse } from '../platform/validate';
import { requireRole } from '../platform/require-role';
import type { DuesRefunds } from './dues-refunds';
import type { MemberAdminService } from './member-admin-service';
import type { PlanAdminService } from './plan-admin-service';
import type { RosterMailService } from './roster-mail-service';
import type { FlyingStatusService } from './flying-status-service';
import { RosterEmailBody, RosterQuerySchema, type RosterQuery } from '../../contracts/membership/roster-schemas';
import { MembershipSettingsInputSchema } from '../../contracts/membership/club-rules-schemas';

const rosterQuery = (value: unknown): { query: RosterQuery; page: number; pageSize: number } => {
  const { page, pageSize, ...query } = parse(RosterQuerySchema, value);
  return { query, page, pageSize };
};

const nullableDate = fields.date.nullable().or(z.literal('').transform(() => null));

// Without defaults, so a PATCH of one field leaves the others as they are.
const PlanFields = z.object({
  name: z.string().trim().min(1, 'Name is required.').max(80),
  description: z.string().trim().max(400),
  duesCents: fields.cents,
  joiningFeeCents: fields.cents,
  active: z.boolean(),
  sortOrder: z.number().int().min(0).max(1000),
});

const NewPlanSchema = PlanFields.extend({
  code: z
    .string()
    .trim()
    .toLowerCase()
    .regex(/^[a-z0-9-]{2,32}$/, 'Use 2-32 lower-case letters, digits or dashes.'),
  eligibility: z.enum(['any', 'junior', 'family']).default('any'),
  description: PlanFields.shape.description.default(''),
  joiningFeeCents: fields.cents.default(0),
  active: z.boolean().default(true),
  sortOrder: PlanFields.shape.sortOrder.default(0),
});

const MemberEditSchema = z.object({
  associationNumber: z.string().trim().max(40).nullable().optional(),
  associationExpires: nullableDate.optional(),
  certificationLevel: z.string().trim().max(16).optional(),
  certificationDate: nullableDate.optional(),
  address: z.string().trim().min(1).max(400).optional(),
  phone: z.string().trim().min(7).max(40).optional(),
  emergencyContact: z.string().trim().min(1).max(200).optional(),
});

const ManualPaymentSchema = z.object({
  amountCents: fields.cents.refine((v) => v > 0, 'Enter the amount received.'),
  method: z.enum(['cash', 'e-transfer', 'cheque'], { error: 'Choose cash, e-transfer or cheque.' }),
  receiptNumber: z
    .string({ error: 'Receipt number is required.' })
    .trim()
    .min(1, 'Receipt number is required.')
    .max(40),
  note: z.string().trim().max(400).optional(),
});

const RefundSchema = z.object({
  paymentId: fields.id,
  amountCents: fields.cents,
  reason: z.string({ error: 'Give a reason.' }).trim().min(1, 'Give a reason.').max(400),
});

// The client's key for one refund: a retry with the same Idempotency-Key gets the first answer, never a second refund.
const IdempotencyKeySchema = z.object({
  key: z
    .string()
    .trim()
    .regex(/^[A-Za-z0-9_.:-]{8,120}$/, 'Use 8-120 letters, digits, dashes, dots, colons or underscores.')
    .optional(),
});

const CheckInSchema = z.object({
  token: z.string({ error: 'Paste or scan a card code.' }).trim().min(1, 'Paste or scan a card code.').max(500),
});

const IdParams = z.object({ id: fields.id });

const Part = z.enum(['association', 'certification'], {
  error: 'Choose the association membership or the certification.',
});

// The values staff saw come along, so a value the member changed meanwhile is not marked verified unseen.
const VerifySchema = z.strictObject({
  what: Part,
  against: z
    .string({ error: 'Say what you checked it against.' })
    .trim()
    .min(3, 'Say what you checked it against (for example: association card, seen at the field).')
    .max(200, 'Use at most 200 characters.'),
  associationNumber: z.string().trim().max(40).nullish(),
  associationExpires: fields.date.nullish(),
  certificationLevel: z.string().trim().max(16).optional(),
});

/** The treasurer's console: roster, member records, payments, refunds, summary, roster e-mail, plans, settings. */
export function memberAdminRoutes(
  service: MemberAdminService,
  plans: PlanAdminService,
  rosterMail: RosterMailService,
  refunds: DuesRefunds,
  flying: FlyingStatusService,
): Router {
  const r = Router();
  r.use(requireRole('treasurer', 'admin'));
  r.get('/', async function listRoster(req, res) {
    const { query, page, pageSize } = rosterQuery(req.query);
    res.json(await service.roster(query, page, pageSize));
  });
  r.get('/export.csv', async function exportRoster(req, res) {
    const { query } = rosterQuery(req.query);
    const csv = await service.exportCsv(query);
    res
      .set('Content-Type', 'text/csv; charset=utf-8')
      .set('Content-Disposition', 'attachment; filename="padside-roster.csv"')
      .send(csv);
  });
  r.get('/summary', async function showSummary(_req, res) {
    res.json(await service.summary());
  });
  r.post('/email', async function emailRoster(req, res) {
    const body = parse(RosterEmailBody, req.body);
    const { page: _page, pageSize: _pageSize, ...filters } = body.filters;
    res.json(await rosterMail.emailRoster(filters, { subject: body.subject, text: body.text }, body.purpose));
  });
  r.get('/plans', async function listPlans(_req, res) {
    res.json(await plans.plans());
  });
  r.post('/plans', async function createPlan(req, res) {
    res.status(201).json(await plans.createPlan(parse(NewPlanSchema, req.body)));
  });
  r.patch('/plans/:id', async function updatePlan(req, res) {
    const { id } = parse(IdParams, req.params);
    res.json(await plans.updatePlan(id, parse(PlanFields.partial(), req.body)));
  });
  r.get('/settings', async function showSettings(_req, res) {
    res.json(await plans.getSettings());
  });
  r.put('/settings', async function saveSettings(req, res) {
    res.json(await plans.putSettings(parse(MembershipSettingsInputSchema, req.body)));
  });
  r.get('/:id', async function showMember(req, res) {
    const { id } = parse(IdParams, req.params);
    res.json(await service.detail(id));
  });
  r.patch('/:id', async function updateMember(req, res) {
    const { id } = parse(IdParams, req.params);
    res.json(await service.update(req.user!.id, id, parse(MemberEditSchema, req.body)));
  });
  r.post('/:id/verifications', async function verifyClaim(req, res) {
    const { id } = parse(IdParams, req.params);
    await flying.verify(req.user!.id, id, parse(VerifySchema, req.body));
    res.json(await service.detail(id));
  });
  r.delete('/:id/verifications/:what', async function withdrawVerification(req, res) {
    const { id, what } = parse(z.object({ id: fields.id, what: Part }), req.params);
    await flying.withdraw(req.user!.id, id, what);
    res.json(await service.detail(id));
  });
  r.post('/:id/payments', async function recordPayment(req, res) {
    const { id } = parse(IdParams, req.params);
    res.status(201).json(await service.manualPayment(req.user!.id, id, parse(ManualPaymentSchema, req.body)));
  });
  r.post('/:id/refunds', async function refundPayment(req, res) {
    const { id } = parse(IdParams, req.params);
    const body = parse(RefundSchema, req.body);
    const { key } = parse(IdempotencyKeySchema, { key: req.header('idempotency-key') });
    await refunds.refund(req.user!.id, id, body, key ?? null);
    res.status(201).json(await service.detail(id));
  });
  return r;
}

/** Launch-day check-in, for any staff member at the field. */
export function checkInRoutes(service: FlyingStatusService): Router {
  const r = Router();
  r.post('/', requireRole('editor', 'treasurer', 'admin'), async function checkIn(req, res) {
    const { token } = parse(CheckInSchema, req.body);
    res.json(await service.checkIn(token));
  });
  return r;
}
