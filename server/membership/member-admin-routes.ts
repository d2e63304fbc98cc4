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
import {
  CheckInSchema,
  ManualPaymentSchema,
  MemberEditSchema,
  NewPlanSchema,
  PlanChangesSchema,
  RefundSchema,
  VerifiedPartSchema,
  VerifySchema,
} from '../../contracts/membership/staff-member-schemas';

const rosterQuery = (value: unknown): { query: RosterQuery; page: number; pageSize: number } => {
  const { page, pageSize, ...query } = parse(RosterQuerySchema, value);
  return { query, page, pageSize };
};

// The client's key for one refund: a retry with the same Idempotency-Key gets the first answer, never a second refund.
const IdempotencyKeySchema = z.object({
  key: z
    .string()
    .trim()
    .regex(/^[A-Za-z0-9_.:-]{8,120}$/, 'Use 8-120 letters, digits, dashes, dots, colons or underscores.')
    .optional(),
});

const IdParams = z.object({ id: fields.id });

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
    res.json(await plans.updatePlan(id, parse(PlanChangesSchema.partial(), req.body)));
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
    const { id, what } = parse(z.object({ id: fields.id, what: VerifiedPartSchema }), req.params);
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
