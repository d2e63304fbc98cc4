import { Router } from 'express';
import type { Config } from '../config';

/** GET /api/site: the team and club names every page shows; public, set by the deployment (TEAM_NAME, CLUB_NAME). */
export function siteRoutes(site: Config['site']): Router {
  const r = Router();
  r.get('/', function siteNames(_req, res) {
    res.json(site);
  });
  return r;
}
