import { Router } from 'express';
import type { Config } from '../config';
import type { SiteNamesView } from '../../contracts/site/site-answers';

/**
 * GET /api/site: the team and club names every page shows and the club's time zone its dates are shown in; public,
 * set by the deployment (TEAM_NAME, CLUB_NAME, CLUB_TIME_ZONE).
 */
export function siteRoutes(site: Config['site'], timeZone: string): Router {
  const r = Router();
  r.get('/', function siteNames(_req, res) {
    const names: SiteNamesView = { ...site, timeZone };
    res.json(names);
  });
  return r;
}
