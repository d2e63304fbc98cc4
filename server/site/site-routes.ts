import { Router } from 'express';
import type { Config } from '../config';

/**
 * GET /api/site: the team and club names every page shows and the club's time zone its dates are shown in; public,
 * set by the deployment (TEAM_NAME, CLUB_NAME, CLUB_TIME_ZONE).
 */
export function siteRoutes(site: Config['site'], timeZone: string): Router {
  const r = Router();
  r.get('/', function siteNames(_req, res) {
    res.json({ ...site, timeZone });
  });
  return r;
}
