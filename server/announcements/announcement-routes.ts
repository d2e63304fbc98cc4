import express, { Router } from 'express';
import { requireRole, requireSignedIn } from '../platform/require-role';
import { fields, parse } from '../platform/validate';
import type { SignUpAnswer } from '../../contracts/announcements/subscription-answers';
import { SignUpSchema, TokenQuery } from '../../contracts/announcements/subscription-schemas';
import { AnnouncementListQuery, AnnouncementPatchSchema, NewAnnouncementSchema } from './announcement-schemas';
import type { AnnouncementService } from './announcement-service';
import { AnnouncementSettingsSchema } from './announcement-settings';
import type { SubscriptionService } from './subscription-service';

/** The one-click unsubscribe path under /api: it takes a form body and no CSRF token (RFC 8058). */
export const ONE_CLICK_PATH = '/subscriptions/unsubscribe';

/** /api/subscriptions: public sign-up with double opt-in, the confirmation link, and unsubscribe by link or one click. */
export function subscriptionRoutes(subscriptions: SubscriptionService): Router {
  const r = Router();
  r.get('/wording', function consentWording(_req, res) {
    res.json(subscriptions.wording());
  });
  r.post('/', async function signUp(req, res) {
    await subscriptions.subscribe(parse(SignUpSchema, req.body), req.ip ?? 'unknown', req.user?.id ?? null);
    res.status(202).json({ queued: true } satisfies SignUpAnswer);
  });
  r.get('/confirm', async function confirmSignUp(req, res) {
    res.json({ confirmed: await subscriptions.confirm(parse(TokenQuery, req.query).token, req.ip ?? 'unknown') });
  });
  r.get('/unsubscribe', function describeUnsubscribe(req, res) {
    res.json(subscriptions.describeUnsubscribe(parse(TokenQuery, req.query).token));
  });
  // Mail clients POST `List-Unsubscribe=One-Click` as a form; the path skips the JSON parser and the CSRF check.
  r.post(
    '/unsubscribe',
    express.urlencoded({ extended: false, limit: '2kb' }),
    async function oneClickUnsubscribe(req, res) {
      res.json({
        unsubscribed: await subscriptions.unsubscribe(
          parse(TokenQuery, req.query).token,
          req.body?.['List-Unsubscribe'] === 'One-Click' ? 'one-click' : 'page',
        ),
      });
    },
  );
  return r;
}

/** /api/account/subscriptions: the signed-in person's lists under their account address. */
export function accountSubscriptionRoutes(subscriptions: SubscriptionService): Router {
  const r = Router();
  r.get('/', requireSignedIn, async function mySubscriptions(req, res) {
    res.json(await subscriptions.mine(req.user!.email));
  });
  return r;
}

/** /api/admin/announcements (editor, admin): compose, preview, test, send, progress; the sender settings (admin). */
export function announcementAdminRoutes(announcements: AnnouncementService): Router {
  const r = Router();
  r.use(requireRole('editor', 'admin'));
  r.get('/', async function listAnnouncements(req, res) {
    res.json(await announcements.list(parse(AnnouncementListQuery, req.query)));
  });
  r.post('/', async function createAnnouncement(req, res) {
    res.status(201).json(await announcements.create(parse(NewAnnouncementSchema, req.body), req.user!.id));
  });
  r.get('/settings', async function announcementSettings(_req, res) {
    res.json(await announcements.getSettings());
  });
  r.put('/settings', requireRole('admin'), async function putAnnouncementSettings(req, res) {
    res.json(await announcements.putSettings(parse(AnnouncementSettingsSchema, req.body)));
  });
  r.get('/:id', async function showAnnouncement(req, res) {
    res.json(await announcements.show(parse(fields.id, req.params.id)));
  });
  r.patch('/:id', async function updateAnnouncement(req, res) {
    res.json(await announcements.update(parse(fields.id, req.params.id), parse(AnnouncementPatchSchema, req.body)));
  });
  r.get('/:id/preview', async function previewAnnouncement(req, res) {
    res.json(await announcements.preview(parse(fields.id, req.params.id), req.user!.email));
  });
  r.post('/:id/test', async function testAnnouncement(req, res) {
    res.status(202).json(await announcements.testSend(parse(fields.id, req.params.id), req.user!.email));
  });
  r.post('/:id/send', async function sendAnnouncement(req, res) {
    res.status(202).json(await announcements.send(parse(fields.id, req.params.id)));
  });
  return r;
}
