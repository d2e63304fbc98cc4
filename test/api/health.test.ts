import request from 'supertest';
import { buildTestApp } from '../helpers/test-app';

describe('GET /api/health', () => {
  it('reports the database, mail and payments as ok when they run', async () => {
    const t = buildTestApp();
    try {
      const res = await request(t.app).get('/api/health');
      expect(res.status).toBe(200);
      expect(res.body).toEqual({ status: 'ok', db: 'ok', mail: 'ok', payments: 'ok' });
    } finally {
      await t.close();
    }
  });

  it('answers 503 with db "down" when the database cannot be reached, and reports mail and payments down', async () => {
    const t = buildTestApp({
      env: {
        DATABASE_URL: 'postgres://padside@127.0.0.1:1/nothing',
        SMTP_URL: 'smtp://127.0.0.1:1',
        STRIPE_API_BASE: 'http://127.0.0.1:1',
      },
    });
    try {
      const res = await request(t.app).get('/api/health');
      expect(res.status).toBe(503);
      expect(res.body).toMatchObject({ db: 'down', mail: 'down', payments: 'down' });
    } finally {
      await t.close();
    }
  });
});
