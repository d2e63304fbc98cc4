import request from 'supertest';
import { buildTestApp, type TestApp } from '../helpers/test-app';

// Invented names, unlike the demo's, to show they come from the environment and not from the code.
let t: TestApp;
beforeAll(() => {
  t = buildTestApp({ env: { TEAM_NAME: 'Nozzle & Nylon', CLUB_NAME: 'Skywhomp Rocketry Club' } });
});
afterAll(() => t.close());

describe('GET /api/site', () => {
  it('gives the team and club names the deployment set', async () => {
    const res = await request(t.app).get('/api/site');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ teamName: 'Nozzle & Nylon', clubName: 'Skywhomp Rocketry Club' });
  });
});

describe('GET /feeds/build-logs.atom', () => {
  it('is titled and signed with the team name', async () => {
    const res = await request(t.app).get('/feeds/build-logs.atom');
    expect(res.status).toBe(200);
    expect(res.text).toContain('<title>Nozzle &amp; Nylon build logs — Padside</title>');
    expect(res.text).toContain('<rights>Nozzle &amp; Nylon</rights>');
  });
});
