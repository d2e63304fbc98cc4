import { createHash, randomInt } from 'node:crypto';
import sharp from 'sharp';
import { storageFromConfig } from '../../server/uploads/storage-from-config';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';

/** A JPEG as a phone writes it: camera, owner, GPS position, and a sideways orientation flag. */
async function phoneJpeg(): Promise<Buffer> {
  // A colour of its own per call: names are the hash of the bytes, so each test stores a new image.
  const background = { r: randomInt(256), g: randomInt(256), b: randomInt(256) };
  return sharp({ create: { width: 40, height: 20, channels: 3, background } })
    .jpeg()
    .withExif({
      IFD0: { Make: 'Gopher Flats Optics', Model: 'Pad Cam 2', Artist: 'Sample Person' },
      IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '49/1 30/1 0/1', GPSLongitudeRef: 'W', GPSLongitude: '97/1 10/1 0/1' },
    })
    .withMetadata({ orientation: 6 })
    .toBuffer();
}

/** The EXIF tag that points at the GPS directory (Exif 2.3, tag 0x8825 GPSInfo), in either byte order. */
const hasGpsPointer = (exif: Buffer) =>
  exif.includes(Buffer.from([0x88, 0x25])) || exif.includes(Buffer.from([0x25, 0x88]));

async function bytesOf(body: NodeJS.ReadableStream): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const c of body) chunks.push(c as Buffer);
  return Buffer.concat(chunks);
}

describe.each([
  ['the local disk', {}],
  ['S3-compatible object storage', { STORAGE_URL: `${process.env.TEST_STORAGE_URL}` }],
])('uploads stored on %s', (_where, env: Record<string, string>) => {
  let t: TestApp;
  let editor: Client;

  beforeAll(async () => {
    t = buildTestApp({ env });
    editor = (await signedIn(t.app, t.deps.db, ['fan', 'editor'])).client;
  });
  afterAll(() => t.close());

  const upload = async (bytes: Buffer) =>
    editor.agent
      .post('/api/admin/uploads')
      .set('X-CSRF-Token', await editor.token())
      .attach('file', bytes, { filename: 'launch-rail.jpg', contentType: 'image/jpeg' });
  const keyOf = (url: string) => url.replace('/uploads/', '');

  it('uses the backend the configuration names', () => {
    expect(t.config.storage.kind).toBe(env.STORAGE_URL ? 's3' : 'disk');
  });

  // OWASP ASVS 4.0.3 8.3.4 (sensitive data identified and handled by a policy; from memory): a photo's position,
  // camera and owner are not published with it.
  it('stores a JPEG without its EXIF (GPS position, camera, names), orientation applied (ASVS 4.0.3 8.3.4)', async () => {
    const jpeg = await phoneJpeg();
    const before = await sharp(jpeg).metadata();
    expect(before.exif && hasGpsPointer(before.exif)).toBe(true);
    expect(jpeg.includes('Gopher Flats Optics')).toBe(true);

    const res = await upload(jpeg);
    expect(res.status).toBe(201);
    // Orientation 6 means "turn a quarter clockwise to view": the 40x20 sensor image is 20 wide, 40 high.
    expect(res.body).toMatchObject({ width: 20, height: 40 });

    // What the store holds, read from the store itself, not only what the route serves.
    const stored = await bytesOf((await storageFromConfig(t.config.storage).read(keyOf(res.body.url)))!.body);
    const after = await sharp(stored).metadata();
    expect(after.format).toBe('jpeg');
    expect(after.exif).toBeUndefined();
    expect(after.orientation).toBeUndefined();
    expect({ width: after.width, height: after.height }).toEqual({ width: 20, height: 40 });
    expect(stored.includes('Gopher Flats Optics')).toBe(false);
    expect(stored.includes('Sample Person')).toBe(false);

    const thumb = await sharp(
      await bytesOf((await storageFromConfig(t.config.storage).read(keyOf(res.body.thumbnailUrl)))!.body),
    ).metadata();
    expect(thumb.exif).toBeUndefined();
  });

  it('serves the stored bytes with the sniffed type, nosniff, a restrictive CSP and a year of caching', async () => {
    const res = await upload(await phoneJpeg());
    const served = await new Client(t.app).get(res.body.url).buffer(true);
    expect(served.status).toBe(200);
    expect(served.headers).toMatchObject({
      'content-type': 'image/jpeg',
      'x-content-type-options': 'nosniff',
      'content-security-policy': "default-src 'none'",
      'cache-control': 'public, max-age=31536000, immutable',
    });
    expect(Number(served.headers['content-length'])).toBe((served.body as Buffer).length);
    expect((await sharp(served.body as Buffer).metadata()).exif).toBeUndefined();
    const thumb = await new Client(t.app).get(res.body.thumbnailUrl);
    expect(thumb.headers['content-type']).toBe('image/webp');
  });

  it('names an image after its bytes: the same file uploaded twice is one image', async () => {
    const jpeg = await phoneJpeg();
    const first = await upload(jpeg);
    const second = await upload(jpeg);
    expect(second.status).toBe(201);
    expect(second.body.url).toBe(first.body.url);
    expect(
      await t.deps.db('uploads').where('key', keyOf(first.body.url)).count<{ count: string }[]>('* as count'),
    ).toEqual([{ count: 1 }]);
  });

  it('answers 415 for an image whose data is cut short, and leaves no object behind', async () => {
    const whole = await sharp({
      create: {
        width: 300,
        height: 200,
        channels: 3,
        background: { r: 0, g: 0, b: 0 },
        noise: { type: 'gaussian', mean: 128, sigma: 60 },
      },
    })
      .png()
      .toBuffer();
    const cut = whole.subarray(0, Math.floor(whole.length / 2));
    const res = await editor.agent
      .post('/api/admin/uploads')
      .set('X-CSRF-Token', await editor.token())
      .attach('file', cut, { filename: 'half.png', contentType: 'image/png' });
    expect(res.status).toBe(415);
    expect(res.body.error.fields.file).toBe('Damaged image.');
    const name = createHash('sha256').update(cut).digest('hex').slice(0, 32);
    const storage = storageFromConfig(t.config.storage);
    expect(await storage.read(`${name}.png`)).toBeNull();
    expect(await storage.read(`${name}-thumb.webp`)).toBeNull();
    expect(await t.deps.db('uploads').where('key', `${name}.png`).first()).toBeUndefined();
  });

  it('deletes an image: its record, the original and the thumbnail objects', async () => {
    const res = await upload(await phoneJpeg());
    const gone = await editor.agent
      .delete(res.body.url.replace('/uploads/', '/api/admin/uploads/'))
      .set('X-CSRF-Token', await editor.token());
    expect(gone.status).toBe(204);
    const storage = storageFromConfig(t.config.storage);
    expect(await storage.read(keyOf(res.body.url))).toBeNull();
    expect(await storage.read(keyOf(res.body.thumbnailUrl))).toBeNull();
    expect((await new Client(t.app).get(res.body.url)).status).toBe(404);
    const again = await editor.agent
      .delete(res.body.url.replace('/uploads/', '/api/admin/uploads/'))
      .set('X-CSRF-Token', await editor.token());
    expect(again.status).toBe(404);
  });
});
