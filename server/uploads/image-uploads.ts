import { createHash } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { Transform, type Readable } from 'node:stream';
import type { Knex } from 'knex';
import sharp, { type Metadata, type Sharp } from 'sharp';
import { AppError, badRequest, conflict, notFound } from '../platform/app-error';
import type { FileStorage } from './file-storage';

// file-type 16 is the last CommonJS release.
// eslint-disable-next-line @typescript-eslint/no-require-imports
const FileType: { fromFile(path: string): Promise<{ ext: string; mime: string } | undefined> } = require('file-type');

export const MAX_IMAGE_BYTES = 5 * 1024 * 1024;
type Ext = 'jpg' | 'png' | 'webp' | 'gif';
const ALLOWED: Record<string, Ext> = {
  'image/jpeg': 'jpg',
  'image/png': 'png',
  'image/webp': 'webp',
  'image/gif': 'gif',
};
const THUMB_WIDTH = 480;

export interface StoredImage {
  id: number;
  url: string;
  thumbnailUrl: string;
  width: number;
  height: number;
}

/** A file multer has written to a temporary folder: the bytes never sit whole in memory. */
export interface ReceivedFile {
  path: string;
  size: number;
  originalName: string;
}

interface UploadRow {
  id: number;
  key: string;
  content_type: string;
  width: number | null;
  height: number | null;
  thumbnail_key: string | null;
}

const damaged = () =>
  new AppError(415, 'unsupported_file', 'The image could not be read; it may be damaged.', { file: 'Damaged image.' });

/**
 * Accepts an image only when its bytes say it is one (ASVS 4.0.3 12.2.1), whatever its name or declared type, and
 * stores it re-encoded without its metadata (camera, GPS position, names), orientation applied.
 */
export class ImageUploads {
  constructor(
    private readonly db: Knex,
    private readonly storage: FileStorage,
    /** What still shows an image (posts, products, sponsor logos), asked of the features before a delete. */
    private readonly usesOf: (urls: readonly string[]) => Promise<string[]> = async () => [],
  ) {}

  /** Checks an uploaded image by its bytes, re-encodes it without metadata with a thumbnail, and stores both under the hash of the bytes. */
  async store(file: ReceivedFile, userId: number | null): Promise<StoredImage> {
    if (file.size > MAX_IMAGE_BYTES)
      throw new AppError(413, 'file_too_large', `Images can be at most ${MAX_IMAGE_BYTES / 1024 / 1024} MB.`, {
        file: 'Too large.',
      });
    // PostgreSQL refuses NUL in text; other control characters have no place in a name shown to editors.
    // eslint-disable-next-line no-control-regex
    if (/[\u0000-\u001f\u007f]/.test(file.originalName))
      throw badRequest('The file name contains a character that is not allowed.', {
        file: 'Rename the file: its name holds a control character.',
      });
    const sniffed = await FileType.fromFile(file.path);
    const ext = sniffed ? ALLOWED[sniffed.mime] : undefined;
    if (!sniffed || !ext) {
      throw new AppError(415, 'unsupported_file', 'Upload a JPEG, PNG, WebP or GIF image.', {
        file: sniffed ? `This file is ${sniffed.mime}, not an image we accept.` : 'This file is not an image.',
      });
    }
    let meta: Metadata;
    try {
      meta = await sharp(file.path, { animated: true }).metadata();
    } catch {
      throw damaged();
    }
    // Named after the uploaded bytes: a name never changes what it holds, so browsers may cache it for a year.
    const hash = await sha256OfFile(file.path);
    const key = `${hash.slice(0, 32)}.${ext}`;
    const thumbKey = `${hash.slice(0, 32)}-thumb.webp`;
    const existing = await this.db<UploadRow>('uploads').where('key', key).first();
    if (existing) return toStored(existing);

    const oriented = meta.autoOrient ?? { width: meta.width, height: meta.height };
    // One after the other: each pipeline decodes the whole image, and the machine serves other requests meanwhile.
    await this.writeImage(thumbKey, reencoded(file.path, meta, 'thumb'), 'image/webp', [thumbKey]);
    const bytes = await this.writeImage(key, reencoded(file.path, meta, ext), sniffed.mime, [thumbKey, key]);
    await this.db('uploads')
      .insert({
        key,
        content_type: sniffed.mime,
        bytes,
        width: oriented.width ?? null,
        height: oriented.height ?? null,
        thumbnail_key: thumbKey,
        original_name: file.originalName.slice(0, 200),
        uploaded_by: userId,
      })
      .onConflict('key')
      .ignore();
    const row = await this.db<UploadRow>('uploads').where('key', key).first();
    return toStored(row!);
  }

  /** A stream of the stored bytes with their type; null for an unknown key. */
  /** The stored images behind `/uploads/...` addresses (sizes, WebP thumbnail), by address; others are left out. */
  async describe(urls: readonly string[]): Promise<Map<string, StoredImage>> {
    const keys = urls.map((u) => /^\/uploads\/([A-Za-z0-9._-]{1,200})$/.exec(u)?.[1]).filter((k): k is string => !!k);
    const rows = keys.length
      ? await this.db<UploadRow>('uploads').whereIn('key', keys).whereNotNull('thumbnail_key')
      : [];
    return new Map(rows.map((r) => [`/uploads/${r.key}`, toStored(r)]));
  }

  /** A stored image or thumbnail with its length and type, or null when the key is not an upload's. */
  async read(key: string): Promise<{ body: Readable; length: number; contentType: string } | null> {
    const row = await this.db<UploadRow>('uploads').where('key', key).orWhere('thumbnail_key', key).first();
    if (!row) return null;
    const stored = await this.storage.read(key);
    if (!stored) return null;
    return { ...stored, contentType: key === row.thumbnail_key ? 'image/webp' : row.content_type };
  }

  /** Removes an image with its thumbnail, record and objects; refused while a page still shows it. */
  async remove(key: string): Promise<void> {
    await this.db.transaction(async (trx) => {
      const row = await trx<UploadRow>('uploads').where('key', key).forUpdate().first();
      if (!row) throw notFound('No such image.');
      // Names are shared by identical uploads, so the same image may be on several pages.
      const uses = await this.usesOf([
        `/uploads/${row.key}`,
        ...(row.thumbnail_key ? [`/uploads/${row.thumbnail_key}`] : []),
      ]);
      if (uses.length)
        throw conflict(
          'image_in_use',
          `This image is still shown on ${uses.slice(0, 3).join(', ')}${uses.length > 3 ? ` and ${uses.length - 3} more` : ''}. Remove it there first.`,
          { image: 'Still in use.' },
        );
      await trx('uploads').where('id', row.id).delete();
      // Objects go inside the transaction: if the store refuses, the record stays and the delete can be retried.
      await this.storage.remove([row.key, ...(row.thumbnail_key ? [row.thumbnail_key] : [])]);
    });
  }

  /** Streams one re-encoded image into storage; a decoding failure is the uploader's 415, not our 500. */
  private async writeImage(key: string, image: Sharp, contentType: string, cleanUp: string[]): Promise<number> {
    let decodeFailed = false;
    image.once('error', () => (decodeFailed = true));
    let bytes = 0;
    const counter = new Transform({
      transform(chunk: Buffer, _enc, done) {
        bytes += chunk.length;
        done(null, chunk);
      },
    });
    image.pipe(counter);
    image.once('error', (err) => counter.destroy(err));
    try {
      await this.storage.write(key, counter, contentType);
    } catch (err) {
      // A store that stopped reading leaves the decoder paused: end it rather than leave it holding the image.
      image.destroy();
      counter.destroy();
      await this.storage.remove(cleanUp).catch(() => undefined);
      if (decodeFailed) throw damaged();
      throw err;
    }
    return bytes;
  }
}

/** Orientation applied, then written without metadata (sharp drops EXIF, XMP and IPTC unless asked to keep them). */
function reencoded(path: string, meta: Metadata, as: Ext | 'thumb'): Sharp {
  const animated = (meta.pages ?? 1) > 1;
  let image = sharp(path, { animated });
  // Animated images carry no EXIF orientation; rotating every frame is not supported.
  if (!animated) image = image.rotate();
  switch (as) {
    case 'thumb':
      return image.resize({ width: THUMB_WIDTH, withoutEnlargement: true }).webp({ quality: 80 });
    case 'jpg':
      return image.jpeg({ quality: 90 });
    case 'png':
      return image.png();
    case 'webp':
      return image.webp({ quality: 90 });
    case 'gif':
      return image.gif();
  }
}

function toStored(row: UploadRow): StoredImage {
  return {
    id: row.id,
    url: `/uploads/${row.key}`,
    thumbnailUrl: `/uploads/${row.thumbnail_key}`,
    width: row.width ?? 0,
    height: row.height ?? 0,
  };
}

async function sha256OfFile(path: string): Promise<string> {
  const hash = createHash('sha256');
  for await (const chunk of createReadStream(path)) hash.update(chunk as Buffer);
  return hash.digest('hex');
}
