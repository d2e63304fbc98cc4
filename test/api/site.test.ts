import request from 'supertest';
import { waitForEmails } from '../helpers/maildev';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';
import { MB_ADDRESS, methodId, stockSticker } from './shop-fixtures';

// Invented names, unlike the demo's, to show they come from the environment and not from the code.
let t: TestApp;
beforeAll(() => {
  t = buildTestApp({
    env: { TEAM_NAME: 'Nozzle & Nylon', CLUB_NAME: 'Skywhomp Rocketry Club', CLUB_TIME_ZONE: 'America/Regina' },
  });
});
afterAll(() => t.close());

describe('GET /api/site', () => {
  it('gives the team and club names and the club time zone the deployment set', async () => {
    const res = await request(t.app).get('/api/site');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({
      teamName: 'Nozzle & Nylon',
      clubName: 'Skywhomp Rocketry Club',
      timeZone: 'America/Regina',
    });
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

describe('the shop e-mails', () => {
  it('carry the configured team name, not the demo one or the software name', async () => {
    const staff = (await signedIn(t.app, t.deps.db, ['fan', 'treasurer'])).client;
    const sticker = await stockSticker(staff, 5);
    const buyer = new Client(t.app);
    const email = `names-${Date.now()}@example.test`;
    const res = await buyer.post('/api/orders', {
      items: [{ variantId: sticker.variants[0].id, quantity: 1 }],
      shipTo: MB_ADDRESS,
      shippingMethodId: await methodId(buyer, 'canada'),
      email,
      paymentToken: 'tok_visa',
    });
    expect(res.status).toBe(201);
    expect(
      (
        await staff.post(`/api/admin/orders/${res.body.order.id}/ship`, {
          carrier: 'Gopherline Courier',
          trackingNumber: 'GL 0001',
        })
      ).status,
    ).toBe(200);
    await t.deps.mail.deliverDue();
    const mails = await waitForEmails(email, /order PS-/, 2);
    expect(mails.map((m) => m.subject).sort()).toEqual([
      `Nozzle & Nylon order ${res.body.order.number} is on its way`,
      `Nozzle & Nylon order ${res.body.order.number}: thank you`,
    ]);
    // Signed with the team's name; the seller line of the receipt is a shop setting that other suites set.
    for (const m of mails) {
      // The sign-off ends the message itself, above the "why you got this" footer.
      expect(m.text.split('\n--\n')[0].trim().split('\n').at(-1)).toBe('Nozzle & Nylon');
      expect(m.text).not.toContain('Padside');
    }
  });
});
