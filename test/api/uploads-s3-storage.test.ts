import { ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3';
import { randomBytes } from 'node:crypto';
import { Readable } from 'node:stream';
import { loadConfig, type StorageConfig } from '../../server/config';
import sharp from 'sharp';
import { S3Storage } from '../../server/uploads/s3-storage';
import { freePort } from '../helpers/tcp-proxy';
import { buildTestApp } from '../helpers/test-app';
import { signedIn } from '../helpers/users';

// The test stack's s3rver; see scripts/stack/throwaway.mjs.
const settings = (prefix: string, overrides: Record<string, string> = {}) =>
  loadConfig({ ...process.env, STORAGE_URL: `${process.env.TEST_STORAGE_URL}-${prefix}`, ...overrides })
    .storage as Extract<StorageConfig, { kind: 's3' }>;

const run = randomBytes(4).toString('hex');
const opened: S3Storage[] = [];
const storage = (prefix = `a${run}`, overrides?: Record<string, string>) => {
  const s = new S3Storage(settings(prefix, overrides));
  opened.push(s);
  return s;
};
afterAll(() => opened.forEach((s) => s.close()));

describe('S3Storage against the test object store', () => {
  it('streams a body in and reads the same bytes back with their length', async () => {
    const s = storage();
    const bytes = randomBytes(300_000);
    // A stream in small chunks, as a sharp pipeline delivers them.
    await s.write('0123abcd.png', Readable.from([bytes.subarray(0, 1000), bytes.subarray(1000)]), 'image/png');
    const back = await s.read('0123abcd.png');
    expect(back!.length).toBe(bytes.length);
    const chunks: Buffer[] = [];
    for await (const c of back!.body) chunks.push(c as Buffer);
    expect(Buffer.concat(chunks).equals(bytes)).toBe(true);
  });

  it('answers null for a key that was never written', async () => {
    expect(await storage().read('never-written.jpg')).toBeNull();
  });

  it('keeps each prefix apart inside the one bucket', async () => {
    const here = storage(`b${run}`);
    const there = storage(`c${run}`);
    await here.write('feed01.webp', Readable.from([Buffer.from('webp bytes')]), 'image/webp');
    expect(await there.read('feed01.webp')).toBeNull();
    const listing = new S3Client({
      endpoint: process.env.S3_ENDPOINT,
      region: 'us-east-1',
      forcePathStyle: true,
      credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
    });
    try {
      const keys = (
        await listing.send(new ListObjectsV2Command({ Bucket: 'padside-test', Prefix: `uploads-b${run}/` }))
      ).Contents?.map((o) => o.Key);
      expect(keys).toEqual([`uploads-b${run}/feed01.webp`]);
    } finally {
      listing.destroy();
    }
  });

  it('removes objects, and removing one already gone is not an error', async () => {
    const s = storage();
    await s.write('dead01.gif', Readable.from([Buffer.from('gif bytes')]), 'image/gif');
    await s.remove(['dead01.gif', 'dead02.gif']);
    expect(await s.read('dead01.gif')).toBeNull();
  });

  it('refuses a key that is not one ImageUploads makes, before any request', async () => {
    await expect(storage().write('../escape.png', Readable.from([Buffer.from('x')]), 'image/png')).rejects.toThrow(
      'bad storage key',
    );
    await expect(storage().read('a/b.png')).rejects.toThrow('bad storage key');
  });

  it('fails loudly, not with a silent null, when the store does not know the access key', async () => {
    const wrong = storage(`a${run}`, { S3_ACCESS_KEY_ID: 'NOT-A-KNOWN-KEY' });
    await expect(wrong.read('0123abcd.png')).rejects.toThrow();
    await expect(wrong.write('bad01.png', Readable.from([Buffer.from('x')]), 'image/png')).rejects.toThrow();
  });

  it('is what the configuration names when STORAGE_URL is set', () => {
    expect(settings('x')).toMatchObject({
      kind: 's3',
      bucket: 'padside-test',
      prefix: 'uploads-x/',
      forcePathStyle: true,
    });
  });
});

describe('when the object store does not answer', () => {
  it('S3Storage answers 503 storage_unavailable with Retry-After, for reads, writes and deletes', async () => {
    const port = await freePort();
    const down = storage(`a${run}`, { S3_ENDPOINT: `http://127.0.0.1:${port}` });
    for (const attempt of [
      () => down.read('0123abcd.png'),
      () => down.write('down01.png', Readable.from([Buffer.from('x')]), 'image/png'),
      () => down.remove(['down01.png']),
    ]) {
      await expect(attempt()).rejects.toMatchObject({
        status: 503,
        code: 'storage_unavailable',
        headers: { 'Retry-After': '30' },
      });
    }
  });

  it('an upload answers 503 with the error shape, not 500', async () => {
    const port = await freePort();
    const t = buildTestApp({
      env: { STORAGE_URL: String(process.env.TEST_STORAGE_URL), S3_ENDPOINT: `http://127.0.0.1:${port}` },
    });
    try {
      const { client } = await signedIn(t.app, t.deps.db, ['fan', 'editor']);
      const png = await sharp({
        create: { width: 9, height: 9, channels: 3, background: { r: 3, g: Date.now() % 256, b: 7 } },
      })
        .png()
        .toBuffer();
      const res = await client.agent
        .post('/api/admin/uploads')
        .set('X-CSRF-Token', await client.token())
        .attach('file', png, { filename: 'down.png', contentType: 'image/png' });
      expect(res.status).toBe(503);
      expect(res.headers['retry-after']).toBe('30');
      expect(res.body.error.code).toBe('storage_unavailable');
    } finally {
      await t.close();
    }
  });
});
