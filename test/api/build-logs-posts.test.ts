import { buildTestApp, fixedClock, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';

let t: TestApp;
let editor: Client;
const clock = fixedClock('2026-11-20T18:00:00Z');
const tag = `t${Date.now().toString(36)}`;

beforeAll(async () => {
  t = buildTestApp({ clock });
  editor = (await signedIn(t.app, t.deps.db, ['fan', 'editor'])).client;
});
afterAll(() => t.close());

const create = async (body: object) => {
  const res = await editor.post('/api/admin/posts', body);
  expect(res.status).toBe(201);
  return res.body as { id: number; slug: string };
};

describe('GET /api/posts/:slug', () => {
  describe('when the post is members-only', () => {
    let slug: string;
    beforeAll(async () => {
      ({ slug } = await create({
        title: 'Secret sauce',
        summary: 'Teaser text',
        markdown: 'The **members** body.',
        status: 'published',
        membersOnly: true,
        tags: [tag],
      }));
    });

    it('answers anonymous callers 200 with the teaser and html null', async () => {
      const res = await new Client(t.app).get(`/api/posts/${slug}`);
      expect(res.status).toBe(200);
      expect(res.body).toMatchObject({ title: 'Secret sauce', summary: 'Teaser text', html: null, membersOnly: true });
    });

    it('withholds the body from fans and sponsors', async () => {
      for (const roles of [['fan'], ['fan', 'sponsor']] as const) {
        const { client } = await signedIn(t.app, t.deps.db, [...roles]);
        expect((await client.get(`/api/posts/${slug}`)).body.html).toBeNull();
      }
    });

    it('shows the body to members, editors and admins', async () => {
      for (const roles of [
        ['fan', 'member'],
        ['fan', 'editor'],
        ['fan', 'admin'],
      ] as const) {
        const { client } = await signedIn(t.app, t.deps.db, [...roles]);
        expect((await client.get(`/api/posts/${slug}`)).body.html).toContain('<strong>members</strong>');
      }
    });
  });

  describe('when the post is a draft or scheduled', () => {
    it('answers 404 to the public', async () => {
      const draft = await create({ title: 'Not yet', markdown: 'x', status: 'draft' });
      expect((await new Client(t.app).get(`/api/posts/${draft.slug}`)).status).toBe(404);
    });
  });

  describe('the hazard notice', () => {
    it('is on for posts tagged rocketry or mentioning motors, flights or launches, whatever the editor sends', async () => {
      const tagged = await create({
        title: 'Quiet title',
        markdown: 'Nothing risky here.',
        tags: ['rocketry'],
        status: 'published',
        hazardNotice: false,
      });
      const motor = await create({
        title: 'Sanding day',
        markdown: 'We fitted the motor mount.',
        status: 'published',
        hazardNotice: false,
      });
      const launch = await create({ title: 'Saturday launch report', markdown: 'It went well.', status: 'published' });
      const plain = await create({
        title: 'Painting the nose cone',
        markdown: 'Two coats of primer.',
        status: 'published',
      });
      const asked = await create({
        title: 'Soldering',
        markdown: 'Hot irons.',
        status: 'published',
        hazardNotice: true,
      });
      const notice = async (slug: string) => (await new Client(t.app).get(`/api/posts/${slug}`)).body.hazardNotice;
      expect([
        await notice(tagged.slug),
        await notice(motor.slug),
        await notice(launch.slug),
        await notice(plain.slug),
        await notice(asked.slug),
      ]).toEqual([true, true, true, false, true]);
    });
  });
});

describe('GET /api/posts', () => {
  it('filters by tag and pages, newest first', async () => {
    for (let i = 1; i <= 3; i++) {
      clock.set(`2026-11-2${i}T18:00:00Z`);
      await create({ title: `Paged ${tag} ${i}`, markdown: 'x', status: 'published', tags: [`${tag}-p`] });
    }
    clock.set('2026-11-20T18:00:00Z');
    const first = await new Client(t.app).get(`/api/posts?tag=${tag}-p&page=1&pageSize=2`);
    expect(first.status).toBe(200);
    expect(first.body.total).toBe(3);
    expect(first.body.items.map((p: { title: string }) => p.title)).toEqual([`Paged ${tag} 3`, `Paged ${tag} 2`]);
    const second = await new Client(t.app).get(`/api/posts?tag=${tag}-p&page=2&pageSize=2`);
    expect(second.body.items.map((p: { title: string }) => p.title)).toEqual([`Paged ${tag} 1`]);
    expect(Object.keys(second.body.items[0]).sort()).toEqual([
      'cover',
      'coverUrl',
      'membersOnly',
      'publishedAt',
      'slug',
      'summary',
      'tags',
      'title',
    ]);
  });

  it('answers 400 for a bad tag or page', async () => {
    const res = await new Client(t.app).get('/api/posts?tag=%3Cscript%3E&page=0');
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['page', 'tag']);
  });
});

describe('POST /api/admin/posts', () => {
  it('answers 400 with a message per field', async () => {
    const res = await editor.post('/api/admin/posts', {
      title: '',
      markdown: '',
      status: 'live',
      tags: ['Not A Tag!'],
      credits: ['x'],
      coverUrl: 'https://elsewhere.test/a.png',
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual([
      'coverUrl',
      'credits.0',
      'markdown',
      'status',
      'tags.0',
      'title',
    ]);
  });

  it('answers 400 on credits for a sponsor that does not exist', async () => {
    const res = await editor.post('/api/admin/posts', {
      title: 'Ghost credit',
      markdown: 'x',
      status: 'draft',
      credits: [999999],
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.credits).toBeDefined();
  });

  it('answers 409 on slug when the address is taken, and makes unique slugs from titles', async () => {
    const a = await create({ title: 'Same title twice', markdown: 'x', status: 'draft' });
    const b = await create({ title: 'Same title twice', markdown: 'x', status: 'draft' });
    expect(b.slug).toBe(`${a.slug}-2`);
    const clash = await editor.post('/api/admin/posts', {
      title: 'Other',
      slug: a.slug,
      markdown: 'x',
      status: 'draft',
    });
    expect(clash.status).toBe(409);
    expect(clash.body.error.fields.slug).toBeDefined();
  });

  describe('when scheduled', () => {
    it('refuses a time in the past and publishes a future one when the job runs after that time', async () => {
      const past = await editor.post('/api/admin/posts', {
        title: 'Too late',
        markdown: 'x',
        status: 'scheduled',
        publishAt: '2026-11-01T00:00:00Z',
      });
      expect(past.status).toBe(400);
      expect(past.body.error.fields.publishAt).toBeDefined();
      const { slug } = await create({
        title: 'Later on',
        markdown: 'x',
        status: 'scheduled',
        publishAt: '2026-11-22T15:00:00Z',
      });
      const job = t.app.jobs.find((j) => j.name === 'publish-scheduled-posts')!;
      await job.run();
      expect((await new Client(t.app).get(`/api/posts/${slug}`)).status).toBe(404);
      clock.set('2026-11-22T15:00:00Z');
      await job.run();
      clock.set('2026-11-20T18:00:00Z');
      const res = await new Client(t.app).get(`/api/posts/${slug}`);
      expect(res.status).toBe(200);
      expect(res.body.publishedAt).toBe('2026-11-22T15:00:00.000Z');
    });
  });
});

describe('POST /api/admin/posts/preview', () => {
  it('renders through the public pipeline and reports the hazard notice', async () => {
    const res = await editor.post('/api/admin/posts/preview', {
      markdown: '# Fins\n\n<script>alert(1)</script>\n\nBefore the flight.',
    });
    expect(res.status).toBe(200);
    expect(res.body.html).toContain('<h1>Fins</h1>');
    expect(res.body.html).not.toContain('<script');
    expect(res.body.hazardNotice).toBe(true);
  });

  it('answers 400 without markdown', async () => {
    expect((await editor.post('/api/admin/posts/preview', {})).status).toBe(400);
  });
});
