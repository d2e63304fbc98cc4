import sharp from 'sharp';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';

let t: TestApp;
let editor: Client;

beforeAll(async () => {
  t = buildTestApp();
  editor = (await signedIn(t.app, t.deps.db, ['fan', 'editor'])).client;
});
afterAll(() => t.close());

const upload = async (bytes: Buffer, name: string, contentType = 'image/png') =>
  editor.agent
    .post('/api/admin/uploads')
    .set('X-CSRF-Token', await editor.token())
    .attach('file', bytes, { filename: name, contentType });

describe('POST /api/admin/uploads (images for build logs)', () => {
  it('stores a real PNG and serves it back with its sniffed type', async () => {
    const png = await sharp({ create: { width: 40, height: 20, channels: 3, background: '#1d3b53' } })
      .png()
      .toBuffer();
    const res = await upload(png, 'fin-can.png');
    expect(res.status).toBe(201);
    expect(res.body.url).toMatch(/^\/uploads\/[a-z0-9-]+\.png$/);
    const served = await new Client(t.app).get(res.body.url);
    expect(served.headers['content-type']).toBe('image/png');
    expect(served.headers['x-content-type-options']).toBe('nosniff');
  });

  describe('when the file is an executable renamed to .png', () => {
    it('answers 415 with a field message naming what it is', async () => {
      // An ELF header (0x7f 'E' 'L' 'F', 64-bit, little-endian) followed by padding: the start of a Linux executable.
      const elf = Buffer.concat([Buffer.from([0x7f, 0x45, 0x4c, 0x46, 0x02, 0x01, 0x01, 0x00]), Buffer.alloc(120)]);
      const res = await upload(elf, 'nice-picture.png');
      expect(res.status).toBe(415);
      expect(res.body.error.code).toBe('unsupported_file');
      expect(res.body.error.fields.file).toMatch(/not an image we accept|not an image/);
    });

    it('refuses a Windows executable (MZ header) renamed to .jpg', async () => {
      const exe = Buffer.concat([Buffer.from('MZ'), Buffer.alloc(200)]);
      const res = await upload(exe, 'cover.jpg', 'image/jpeg');
      expect(res.status).toBe(415);
      expect(res.body.error.fields.file).toBeDefined();
    });
  });

  describe('when the file is larger than 5 MB', () => {
    it('answers 413 with a clear message', async () => {
      const big = Buffer.alloc(5 * 1024 * 1024 + 1, 0x41);
      const res = await upload(big, 'huge.png');
      expect(res.status).toBe(413);
      expect(res.body.error).toMatchObject({ code: 'file_too_large', fields: { file: 'Too large.' } });
      expect(res.body.error.message).toMatch(/5 MB/);
    });
  });

  describe('when the file is not an image', () => {
    it('answers 415 for plain text and for an SVG (script-capable, not on the list)', async () => {
      const text = await upload(Buffer.from('just some notes about fins\n'), 'notes.png');
      expect(text.status).toBe(415);
      const svg = await upload(
        Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'),
        'logo.svg',
        'image/svg+xml',
      );
      expect(svg.status).toBe(415);
    });
  });

  it('answers 400 when no file is sent', async () => {
    const res = await editor.agent
      .post('/api/admin/uploads')
      .set('X-CSRF-Token', await editor.token())
      .field('note', 'nothing attached');
    expect(res.status).toBe(400);
    expect(res.body.error.fields.file).toBe('Required.');
  });
});

/** A raw multipart body: supertest's `attach` would refuse to write what an attacker can. */
const rawMultipart = async (body: string | Buffer, boundary = 'padside-boundary') =>
  editor.agent
    .post('/api/admin/uploads')
    .set('X-CSRF-Token', await editor.token())
    .set('Content-Type', `multipart/form-data; boundary=${boundary}`)
    .send(Buffer.isBuffer(body) ? body : Buffer.from(body, 'latin1'));

describe('malformed multipart bodies (OWASP ASVS 4.0.3 5.1.3: input validated, bad input refused with a 4xx)', () => {
  it.each([
    [
      'a body cut off inside a part',
      '--padside-boundary\r\nContent-Disposition: form-data; name="file"; filename="fin.png"\r\nContent-Type: image/png\r\n\r\n\x89PNG',
    ],
    [
      'a part header with no end',
      '--padside-boundary\r\nContent-Disposition: form-data; name="file"; filename="fin.png"',
    ],
    ['a body without its boundary', 'this is not a multipart body at all'],
  ])('answers 400 bad_upload for %s', async (_what, body) => {
    const res = await rawMultipart(body);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_upload');
    expect(res.body.error.fields.file).toBeDefined();
  });

  it('answers 400 for a multipart type without a boundary', async () => {
    const res = await editor.agent
      .post('/api/admin/uploads')
      .set('X-CSRF-Token', await editor.token())
      .set('Content-Type', 'multipart/form-data')
      .send('--x\r\n');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_upload');
  });
});

describe('a NUL byte in the file name (OWASP ASVS 4.0.3 12.3.1: user-supplied file names are never used as given)', () => {
  const withName = async (disposition: string) => {
    // A colour no other test uses, so this image's name (its hash) is new and nothing else can have stored it.
    const png = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#20406a' } })
      .png()
      .toBuffer();
    return Buffer.concat([
      Buffer.from(
        `--padside-boundary\r\nContent-Disposition: form-data; name="file"; ${disposition}\r\nContent-Type: image/png\r\n\r\n`,
        'latin1',
      ),
      png,
      Buffer.from('\r\n--padside-boundary--\r\n', 'latin1'),
    ]);
  };
  const uploadsNamed = async (pattern: string) =>
    Number(
      (await t.deps.db('uploads').where('original_name', 'like', pattern).count<{ count: string }[]>('* as count'))[0]
        .count,
    );

  it('answers 400 naming the file field for a NUL encoded in the name (RFC 5987 filename*), and stores nothing', async () => {
    const res = await rawMultipart(await withName("filename*=UTF-8''nul-probe%00shot.png"));
    expect(res.status).toBe(400);
    expect(res.body.error.fields.file).toMatch(/name/i);
    expect(await uploadsNamed('nul-probe%')).toBe(0);
  });

  it('answers 400 bad_upload for a raw NUL byte inside the part header', async () => {
    const res = await rawMultipart(await withName('filename="fin\u0000can.png"'));
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_upload');
  });
});

describe('DELETE /api/admin/uploads/:key', () => {
  const freshPng = () =>
    sharp({
      create: {
        width: 12,
        height: 12,
        channels: 3,
        background: { r: Math.floor(Math.random() * 256), g: 90, b: Math.floor(Math.random() * 256) },
      },
    })
      .png()
      .toBuffer();
  const remove = async (url: string) =>
    editor.agent.delete(url.replace('/uploads/', '/api/admin/uploads/')).set('X-CSRF-Token', await editor.token());

  it('answers 409 naming the post while a build log still shows the image, and keeps it', async () => {
    const up = await upload(await freshPng(), 'cover.png');
    const title = `Cover in use ${Date.now()}`;
    const token = await editor.token();
    const post = await editor.agent
      .post('/api/admin/posts')
      .set('X-CSRF-Token', token)
      .send({ title, markdown: 'Text.', coverUrl: up.body.url, status: 'draft' });
    expect(post.status).toBe(201);
    const res = await remove(up.body.url);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('image_in_use');
    expect(res.body.error.message).toContain(`the build log “${title}”`);
    expect((await new Client(t.app).get(up.body.url)).status).toBe(200);
  });

  it('answers 409 while a build log body shows the thumbnail', async () => {
    const up = await upload(await freshPng(), 'inline.png');
    const post = await editor.agent
      .post('/api/admin/posts')
      .set('X-CSRF-Token', await editor.token())
      .send({ title: `Inline ${Date.now()}`, markdown: `![small](${up.body.thumbnailUrl})`, status: 'draft' });
    expect(post.status).toBe(201);
    expect((await remove(up.body.url)).status).toBe(409);
  });

  it('answers 409 while a sponsor logo or a product picture shows it', async () => {
    const logo = await upload(await freshPng(), 'logo.png');
    const name = `Gopher Flats Hobby Supply ${Date.now()}`;
    expect(
      (
        await editor.agent
          .post('/api/admin/sponsors')
          .set('X-CSRF-Token', await editor.token())
          .send({ name, logoUrl: logo.body.url })
      ).status,
    ).toBe(201);
    const logoRes = await remove(logo.body.url);
    expect(logoRes.status).toBe(409);
    expect(logoRes.body.error.message).toContain(`the sponsor “${name}”`);

    const picture = await upload(await freshPng(), 'tee.png');
    const slug = `in-use-tee-${Date.now()}`;
    await t.deps.db('shop_products').insert({
      slug,
      name: `Tee ${slug}`,
      price_cents: 2500,
      weight_grams: 180,
      images: JSON.stringify([{ url: picture.body.url, thumbnailUrl: picture.body.thumbnailUrl, alt: 'Tee' }]),
    });
    const pictureRes = await remove(picture.body.url);
    expect(pictureRes.status).toBe(409);
    expect(pictureRes.body.error.message).toContain(`the product “Tee ${slug}”`);
  });

  it('answers 404 for a thumbnail name or a key that does not exist', async () => {
    const up = await upload(await freshPng(), 'thumb.png');
    expect((await remove(up.body.thumbnailUrl)).status).toBe(404);
    expect((await remove('/uploads/0000nothere.png')).status).toBe(404);
  });
});
