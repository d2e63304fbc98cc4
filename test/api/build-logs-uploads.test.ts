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
  editor.agent.post('/api/admin/uploads').set('X-CSRF-Token', await editor.token()).attach('file', bytes, { filename: name, contentType });

describe('POST /api/admin/uploads (images for build logs)', () => {
  it('stores a real PNG and serves it back with its sniffed type', async () => {
    const png = await sharp({ create: { width: 40, height: 20, channels: 3, background: '#1d3b53' } }).png().toBuffer();
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
      const svg = await upload(Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'), 'logo.svg', 'image/svg+xml');
      expect(svg.status).toBe(415);
    });
  });

  it('answers 400 when no file is sent', async () => {
    const res = await editor.agent.post('/api/admin/uploads').set('X-CSRF-Token', await editor.token()).field('note', 'nothing attached');
    expect(res.status).toBe(400);
    expect(res.body.error.fields.file).toBe('Required.');
  });
});
