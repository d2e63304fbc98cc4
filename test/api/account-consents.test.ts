import { strFromU8, unzipSync } from 'fflate';
import type { Response } from 'supertest';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type Client } from '../helpers/users';
import { announcementMail, confirmedSubscriber } from './announcement-fixtures';

let t: TestApp;
let editor: Client;
beforeAll(async () => {
  t = buildTestApp();
  editor = (await signedIn(t.app, t.deps.db, ['fan', 'editor'])).client;
});
afterAll(() => t.close());

const binary = (res: Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

describe('a person’s consents in the download and the deletion', () => {
  it('exports the lists they confirmed with the wording shown, and deletion withdraws them so no later announcement reaches the address', async () => {
    const { client, user } = await signedIn(t.app, t.deps.db);
    await confirmedSubscriber(t.app, client, t.deps.db, user.email, ['launches']);

    const res = await client
      .get('/api/account/export')
      .buffer(true)
      .parse(binary as never);
    expect(res.status).toBe(200);
    const files = unzipSync(new Uint8Array(res.body as Buffer));
    expect(JSON.parse(strFromU8(files['consents.json']))).toEqual([
      expect.objectContaining({
        email: user.email,
        topic: 'launches',
        confirmedHow: expect.any(String),
        withdrawnAt: null,
        wordingText: expect.any(String),
      }),
    ]);
    expect(strFromU8(files['summary.html'])).toContain('Lists you asked to hear from');

    expect((await client.post('/api/account/delete', { password: user.password })).status).toBe(200);
    const row = await t.deps.db('subscriptions').where('email', user.email).first();
    expect(row.withdrawn_at).not.toBeNull();
    expect(row.user_id).toBeNull();
    expect(
      await t.deps.db('email_suppressions').where('email', user.email).whereNull('list').count({ n: '*' }),
    ).toEqual([{ n: 1 }]);

    const draft = await editor.post('/api/admin/announcements', {
      topic: 'launches',
      subject: `Fly day ${Date.now()}`,
      markdown: 'The field is mowed.',
    });
    expect(draft.status).toBe(201);
    expect((await editor.post(`/api/admin/announcements/${draft.body.announcement.id}/send`)).status).toBe(202);
    expect(await announcementMail(t.deps.db, user.email, draft.body.announcement.id)).toHaveLength(0);
  });
});
