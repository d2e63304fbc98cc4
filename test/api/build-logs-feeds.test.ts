import { buildTestApp, fixedClock, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';

// `feed` ships only ES modules: jest must transform it, so jest.config.js's transformIgnorePatterns has to let `feed` through
// (as it does for `marked`); under a config that does not, these requests answer 500 inside jest only.
let t: TestApp;
let editor: Client;

beforeAll(async () => {
  t = buildTestApp({ clock: fixedClock('2027-01-05T18:00:00Z') });
  editor = (await signedIn(t.app, t.deps.db, ['fan', 'editor'])).client;
  await editor.post('/api/admin/posts', {
    title: 'Feed public flight',
    summary: 'Public summary',
    markdown: 'The **public** body before the flight.',
    status: 'published',
    tags: ['rocketry'],
  });
  await editor.post('/api/admin/posts', {
    title: 'Feed members corner',
    summary: 'Members summary',
    markdown: 'SECRET-MEMBERS-BODY',
    status: 'published',
    membersOnly: true,
  });
});
afterAll(() => t.close());

describe('GET /feeds/build-logs.rss and .atom', () => {
  it('serves RSS 2.0 with the newest posts, the hazard notice, and no members-only body', async () => {
    const res = await new Client(t.app).get('/feeds/build-logs.rss');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^application\/rss\+xml/);
    expect(res.text).toMatch(/<rss version="2.0"/);
    expect(res.text).toContain('<title><![CDATA[Feed public flight]]></title>');
    expect(res.text).toContain('<strong>public</strong>');
    expect(res.text).toContain('Safety first.');
    expect(res.text).toContain('Members summary');
    expect(res.text).not.toContain('SECRET-MEMBERS-BODY');
  });

  it('serves Atom 1.0 with the same items', async () => {
    const res = await new Client(t.app).get('/feeds/build-logs.atom');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^application\/atom\+xml/);
    expect(res.text).toContain('<feed xmlns="http://www.w3.org/2005/Atom">');
    expect(res.text).toContain('/build-logs/feed-public-flight');
    expect(res.text).not.toContain('SECRET-MEMBERS-BODY');
  });
});
