import { Router } from 'express';
import {
  AutoRenewBody,
  JoinBody,
  ProfileEditBody,
  DuesQuoteQuery,
  RenewBody,
} from '../../contracts/membership/membership-schemas';
import { parse } from '../platform/validate';
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
    const body = parse(DuesQuoteQuery, req.body);
    res.json(await service.quote(req.user?.id ?? null, body.planId, body.on));
  });
  r.post('/', requireSignedIn, async function join(req, res) {
    const body = parse(JoinBody, req.body);
    res
      .status(201)
      .json(await throttle.attempt(payer(req.sessionID, req.user!), () => service.join(req.user!, body), answered));
  });
  r.get('/me', requireSignedIn, async function showMyMembership(req, res) {
    res.json(await record.meOrNone(req.user!.id));
  });
  r.patch('/me', requireSignedIn, async function updateMyProfile(req, res) {
    res.json(await record.updateProfile(req.user!, parse(ProfileEditBody, req.body)));
  });
  r.post('/renew', requireSignedIn, async function renew(req, res) {
    const body = parse(RenewBody, req.body);
    res.json(await throttle.attempt(payer(req.sessionID, req.user!), () => service.renew(req.user!, body), answered));
  });
  r.post('/auto-renew', requireSignedIn, async function setAutoRenew(req, res) {
    const body = parse(AutoRenewBody, req.body);
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
