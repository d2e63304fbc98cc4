import { Router } from 'express';
import { z } from 'zod';
import { fields, parse } from '../platform/validate';
import { requireSignedIn } from '../platform/require-role';
import type { PayerKeys, PaymentThrottle } from '../payments/payment-throttle';
import type { SessionUser } from '../platform/roles';
import type { MemberRecordService } from './member-record-service';
import type { MembershipService } from './membership-service';

const payer = (sessionId: string, user: SessionUser): PayerKeys => ({
  sessionId,
  email: user.email,
  accountId: user.id,
});
/** Every dues answer that returns a membership means the card went through (declines are thrown as 402). */
const answered = () => true;

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

const JoinSchema = z.object({
  planId: fields.id,
  profile: ProfileSchema,
  waiverVersion: z.string({ error: 'Accept the waiver.' }).min(1, 'Accept the waiver.').max(32),
  safetyCodeVersion: z.string().max(32).optional(),
  paymentToken: fields.cardToken,
  autoRenew: z.boolean().optional(),
});

const RenewSchema = z.object({
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

const QuoteSchema = z.object({ planId: fields.id, on: fields.date.optional() });

// The member's own corrections between renewals: never the name or date of birth, which staff change.
const ProfileEditSchema = ProfileSchema.pick({
  address: true,
  phone: true,
  emergencyContact: true,
  associationNumber: true,
  associationExpires: true,
  certificationLevel: true,
  certificationDate: true,
}).partial();

const AutoRenewSchema = z.object({
  autoRenew: z.boolean({ error: 'Choose on or off.' }),
  paymentToken: fields.cardToken.optional(),
});

/** The member's side: plans, quote, join, renew, own membership, auto-renew, card. */
export function membershipRoutes(
  service: MembershipService,
  record: MemberRecordService,
  throttle: PaymentThrottle,
): Router {
  const r = Router();
  r.get('/plans', async function listPlans(_req, res) {
    res.json(await service.plans());
  });
  r.get('/policy', async function showPolicy(_req, res) {
    res.json(await service.policy());
  });
  r.post('/quote', async function quoteDues(req, res) {
    const body = parse(QuoteSchema, req.body);
    res.json(await service.quote(req.user?.id ?? null, body.planId, body.on));
  });
  r.post('/', requireSignedIn, async function join(req, res) {
    const body = parse(JoinSchema, req.body);
    res
      .status(201)
      .json(await throttle.attempt(payer(req.sessionID, req.user!), () => service.join(req.user!, body), answered));
  });
  r.get('/me', requireSignedIn, async function showMyMembership(req, res) {
    res.json(await record.meOrNone(req.user!.id));
  });
  r.patch('/me', requireSignedIn, async function updateMyProfile(req, res) {
    res.json(await record.updateProfile(req.user!, parse(ProfileEditSchema, req.body)));
  });
  r.post('/renew', requireSignedIn, async function renew(req, res) {
    const body = parse(RenewSchema, req.body);
    res.json(await throttle.attempt(payer(req.sessionID, req.user!), () => service.renew(req.user!, body), answered));
  });
  r.post('/auto-renew', requireSignedIn, async function setAutoRenew(req, res) {
    const body = parse(AutoRenewSchema, req.body);
    // Putting a card on file is checked by the processor too, so a card tester could use it: same throttle.
    res.json(
      await throttle.attempt(payer(req.sessionID, req.user!), () => record.setAutoRenew(req.user!, body), answered),
    );
  });
  r.get('/card', requireSignedIn, async function showCard(req, res) {
    res.set('Cache-Control', 'no-store');
    res.json(await record.card(req.user!.id));
  });
  return r;
}
