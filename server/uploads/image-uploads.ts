import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import sharp, { type Metadata } from 'sharp';
import { AppError } from '../platform/app-error';
import type { FileStorage } from './file-storage';

// file-type 16 is the last CommonJS release.
// eslint-disable-next-line @typescript-eslint/no-require-imports
const FileType: { fromBuffer(b: Buffer): Promise<{ ext: string; mime: string } | undefined> } = require('file-type');

export const MAX_IMAGE_BYTES = 5 * 1024 * 1024;
const ALLOWED: Record<string, 'jpg' | 'png' | 'webp' | 'gif'> = { 'image/jpeg': 'jpg', 'image/png': 'png', 'image/webp': 'webp', 'image/gif': 'gif' };
const THUMB_WIDTH = 480;

export interface StoredImage {
  id: number;
  url: string;
  thumbnailUrl: string;
  width: number;
  height: number;
}

/** Accepts an image only when its bytes say it is one (ASVS 4.0.3 12.2.1), whatever its name or declared type. */
export class ImageUploads {
  constructor(
    private readonly db: Knex,
    private readonly storage: FileStorage,
  ) {}

  async store(bytes: Buffer, originalName: string, userId: number | null): Promise<StoredImage> {
    if (bytes.length > MAX_IMAGE_BYTES) throw new AppError(413, 'file_too_large', `Images can be at most ${MAX_IMAGE_BYTES / 1024 / 1024} MB.`, { file: 'Too large.' });
    const sniffed = await FileType.fromBuffer(bytes);
    const ext = sniffed ? ALLOWED[sniffed.mime] : undefined;
    if (!sniffed || !ext) {
      throw new AppError(415, 'unsupported_file', 'Upload a JPEG, PNG, WebP or GIF image.', { file: sniffed ? `This file is ${sniffed.mime}, not an image we accept.` : 'This file is not an image.' });
    }
    let meta: Metadata;
    let thumb: Buffer;
    try {
      meta = await sharp(bytes).metadata();
      thumb = await sharp(bytes).rotate().resize({ width: THUMB_WIDTH, withoutEnlargement: true }).webp({ quality: 80 }).toBuffer();
    } catch {
      throw new AppError(415, 'unsupported_file', 'The image could not be read; it may be damaged.', { file: 'Damaged image.' });
    }
    const id = randomUUID();
    const key = `${id}.${ext}`;
    const thumbKey = `${id}-thumb.webp`;
    await this.storage.put(key, bytes);
    await this.storage.put(thumbKey, thumb);
    const [row] = await this.db('uploads')
      .insert({ key, content_type: sniffed.mime, bytes: bytes.length, width: meta.width ?? null, height: meta.height ?? null, thumbnail_key: thumbKey, original_name: originalName.slice(0, 200), uploaded_by: userId })
      .returning('id');
    return { id: Number(row.id), url: `/uploads/${key}`, thumbnailUrl: `/uploads/${thumbKey}`, width: meta.width ?? 0, height: meta.height ?? 0 };
  }

  /** Bytes and type for serving; null for an unknown key. */
  async read(key: string): Promise<{ bytes: Buffer; contentType: string } | null> {
    const row = await this.db('uploads').where('key', key).orWhere('thumbnail_key', key).first();
    if (!row) return null;
    const bytes = await this.storage.get(key);
    if (!bytes) return null;
    return { bytes, contentType: key === row.thumbnail_key ? 'image/webp' : row.content_type };
  }
}
