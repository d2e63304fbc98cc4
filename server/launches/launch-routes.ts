import { Router } from 'express';
import { requireRole, requireSignedIn } from '../platform/require-role';
import { fields, parse } from '../platform/validate';
import type { FlightService } from './flight-service';
import {
  CallOffSchema,
  CheckInSchema,
  FlightSchema,
  LaunchPatchSchema,
  LaunchSettingsSchema,
  ListQuery,
  NewLaunchSchema,
  RsvpSchema,
} from '../../contracts/launches/launch-schemas';
import type { LaunchService } from './launch-service';

/** Range officers and admins (admins can do everything a range officer can). */
export const RANGE_STAFF = requireRole('range_officer', 'admin');

/** /api/launches: the public calendar and a launch's page; RSVP, check-in and flight cards. */
export function launchRoutes(launches: LaunchService, flights: FlightService): Router {
  const r = Router();
  r.get('/', async function listLaunches(req, res) {
    res.json(await launches.list(parse(ListQuery, req.query)));
  });
  r.get('/:id', async function showLaunch(req, res) {
    res.json(await launches.show(parse(fields.id, req.params.id), req.user?.id ?? null));
  });
  r.get('/:id/results', async function launchResults(req, res) {
    res.json(await flights.results(parse(fields.id, req.params.id)));
  });
  r.post('/:id/rsvp', requireSignedIn, async function rsvp(req, res) {
    res.json(await launches.rsvp(parse(fields.id, req.params.id), req.user!.id, parse(RsvpSchema, req.body).going));
  });
  r.post('/:id/check-in', RANGE_STAFF, async function checkIn(req, res) {
    res.json(
      await launches.checkIn(parse(fields.id, req.params.id), parse(CheckInSchema, req.body).token, req.user!.id),
    );
  });
  r.post('/:id/flights', requireSignedIn, async function fileFlight(req, res) {
    res
      .status(201)
      .json(await flights.file(parse(fields.id, req.params.id), req.user!.id, parse(FlightSchema, req.body)));
  });
  return r;
}

/** /api/admin/launches (range officer, admin): create, change, call off, close; attendance, queue, settings. */
export function launchAdminRoutes(launches: LaunchService, flights: FlightService): Router {
  const r = Router();
  r.use(RANGE_STAFF);
  r.get('/', async function listLaunchesAdmin(_req, res) {
    res.json(await launches.listAll());
  });
  r.post('/', async function createLaunch(req, res) {
    res.status(201).json(await launches.create(parse(NewLaunchSchema, req.body), req.user!.id));
  });
  r.get('/settings', async function launchSettings(_req, res) {
    res.json(await launches.getSettings());
  });
  r.put('/settings', async function putLaunchSettings(req, res) {
    res.json(await launches.putSettings(parse(LaunchSettingsSchema, req.body)));
  });
  r.patch('/:id', async function updateLaunch(req, res) {
    res.json(await launches.update(parse(fields.id, req.params.id), parse(LaunchPatchSchema, req.body)));
  });
  r.post('/:id/call-off', async function callOffLaunch(req, res) {
    res.json(await launches.callOff(parse(fields.id, req.params.id), parse(CallOffSchema, req.body).reason));
  });
  r.post('/:id/done', async function closeLaunch(req, res) {
    res.json(await launches.markDone(parse(fields.id, req.params.id)));
  });
  r.get('/:id/attendance', async function launchAttendance(req, res) {
    res.json(await launches.attendance(parse(fields.id, req.params.id)));
  });
  r.get('/:id/queue', async function rangeQueue(req, res) {
    res.json(await flights.queue(parse(fields.id, req.params.id)));
  });
  return r;
}

/** /feeds/launches.ics: the calendar feed members subscribe to from their phones. */
export function launchFeedRoutes(launches: LaunchService): Router {
  const r = Router();
  r.get('/launches.ics', async function launchFeed(_req, res) {
    res
      .type('text/calendar; charset=utf-8')
      .set('Cache-Control', 'public, max-age=900')
      .send(await launches.calendar());
  });
  return r;
}
