import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';

let t: TestApp;
let staff: Client;
beforeAll(async () => {
  t = buildTestApp();
  staff = (await signedIn(t.app, t.deps.db, ['fan', 'editor', 'treasurer', 'admin'])).client;
});
afterAll(() => t.close());

const product = (extra: object = {}) => ({
  name: 'Bad bytes tee',
  priceCents: 2500,
  weightGrams: 200,
  variants: [{ label: 'M' }],
  ...extra,
});

/** Sends raw JSON text, so escapes such as \ud800 reach the server as they are. */
async function sendRaw(client: Client, method: 'post' | 'patch', url: string, json: string) {
  const token = await client.token();
  return client.agent[method](url).set('X-CSRF-Token', token).set('Content-Type', 'application/json').send(json);
}

// OWASP ASVS 4.0.3 5.1.3 (input validated against an allow-list of characters) and 5.1.4 (structured data checked
// for allowed characters): PostgreSQL refuses U+0000, so NUL used to reach the database and answer 500.
describe('ASVS 5.1.3: U+0000 and lone surrogates in any text', () => {
  it('answers 400 naming the field for NUL in a JSON body field', async () => {
    const res = await staff.post('/api/admin/products', product({ name: 'Tee\u0000shirt' }));
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.fields).toEqual({ name: expect.stringContaining('U+0000') });
  });

  it('names a nested field by its path', async () => {
    const res = await staff.post('/api/admin/products', product({ variants: [{ label: 'M\u0000' }] }));
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['variants.0.label']);
  });

  it('answers 400 for NUL on a route whose schema would accept any string (the registration name)', async () => {
    const res = await new Client(t.app).post('/api/auth/register', {
      email: `nul-${Date.now()}@example.test`,
      password: 'correct horse battery staple',
      displayName: 'A\u0000B',
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('displayName');
  });

  it('answers 400 for a lone surrogate, which would otherwise be stored as U+FFFD', async () => {
    const res = await sendRaw(
      staff,
      'post',
      '/api/admin/products',
      JSON.stringify(product({ name: 'X' })).replace('"X"', '"Tee \\ud800 shirt"'),
    );
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ name: expect.stringContaining('surrogate') });
  });

  it('keeps a proper surrogate pair (an emoji) as it is', async () => {
    const res = await staff.post('/api/admin/products', product({ name: 'Rocket tee \u{1F680}' }));
    expect(res.status).toBe(201);
    expect(res.body.product.name).toBe('Rocket tee \u{1F680}');
  });

  it('answers 400 naming the query parameter for NUL in a query string', async () => {
    const res = await staff.get('/api/admin/posts?q=a%00b');
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('q');
  });

  it('answers 404 for NUL in a path segment', async () => {
    const res = await new Client(t.app).get('/api/posts/a%00b');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
    expect((await new Client(t.app).get('/api/products/a%00b')).status).toBe(404);
    expect((await staff.get('/api/admin/members/1%00')).status).toBe(404);
  });
});

// OWASP ASVS 4.0.3 5.1.4 (structured data checked against its rules, here nesting depth): Markdown nested 2,000
// levels deep overflowed the renderer's stack, was stored anyway, and then broke its public page for every visitor.
describe('ASVS 5.1.4: Markdown nested too deep', () => {
  const deep = '>'.repeat(2000) + ' boom';

  it('refuses a product description that cannot be rendered with 400 naming the field', async () => {
    const res = await staff.post('/api/admin/products', product({ name: 'Deep tee', description: deep }));
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ description: expect.stringContaining('nested too deeply') });
    const made = await staff.post('/api/admin/products', product({ name: 'Shallow tee', description: '> fine' }));
    expect(made.status).toBe(201);
    const patched = await staff.patch(`/api/admin/products/${made.body.product.id}`, { description: deep });
    expect(patched.status).toBe(400);
    expect(patched.body.error.fields).toHaveProperty('description');
  });

  it('refuses a build log body and its preview with 400 naming the field', async () => {
    const res = await staff.post('/api/admin/posts', { title: 'Deep post', markdown: deep, status: 'draft' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('markdown');
    const preview = await staff.post('/api/admin/posts/preview', { markdown: deep });
    expect(preview.status).toBe(400);
    expect(preview.body.error.fields).toHaveProperty('markdown');
  });

  it('still shows the public pages when such a value is already stored', async () => {
    const made = await staff.post(
      '/api/admin/products',
      product({ name: 'Stored deep tee', description: 'fine for now' }),
    );
    await t.deps.db('shop_products').where('id', made.body.product.id).update({ description_md: deep });
    const page = await new Client(t.app).get(`/api/products/${made.body.product.slug}`);
    expect(page.status).toBe(200);
    expect(page.body.descriptionHtml).toContain('boom');
    expect(page.body.descriptionHtml).not.toContain('<blockquote>');

    const post = await staff.post('/api/admin/posts', {
      title: `Stored deep post ${Date.now()}`,
      markdown: 'fine for now',
      status: 'published',
    });
    await t.deps.db('posts').where('id', post.body.id).update({ markdown: deep });
    const read = await new Client(t.app).get(`/api/posts/${post.body.slug}`);
    expect(read.status).toBe(200);
    expect(read.body.html).toContain('boom');
    expect((await new Client(t.app).get('/feeds/build-logs.rss')).status).toBe(200);
  });
});
