import { mkdirSync } from 'node:fs';
import { rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { AppError, notFound } from '../platform/app-error';
import { requireRole } from '../platform/require-role';
import { STORAGE_KEY } from './file-storage';
import { ImageUploads, MAX_IMAGE_BYTES } from './image-uploads';

const tooLarge = () =>
  new AppError(413, 'file_too_large', `Images can be at most ${MAX_IMAGE_BYTES / 1024 / 1024} MB.`, {
    file: 'Too large.',
  });

/**
 * multer writing to a temporary folder with a byte limit (ASVS 4.0.3 12.1.1). Its own limit errors and the parser's
 * complaints about a malformed body become our 4xx; a failing disk stays a 500.
 */
function singleFile(tempDir: string): RequestHandler {
  mkdirSync(tempDir, { recursive: true, mode: 0o700 });
  const receive = multer({
    dest: tempDir,
    limits: { fileSize: MAX_IMAGE_BYTES, files: 1, fields: 10, parts: 12, fieldSize: 10_000 },
  }).single('file');
  return function receiveUpload(req, res, next) {
    receive(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError)
        return next(
          err.code === 'LIMIT_FILE_SIZE'
            ? tooLarge()
            : new AppError(400, 'bad_upload', err.message, { file: err.message }),
        );
      if (isParserError(err))
        return next(
          new AppError(400, 'bad_upload', 'The upload was not a well-formed form; choose the image again.', {
            file: 'The upload arrived damaged.',
          }),
        );
      next(err);
    });
  };
}

/** busboy's errors about the body itself: plain Errors without a system error code. */
function isParserError(err: unknown): boolean {
  if (!(err instanceof Error) || (err as NodeJS.ErrnoException).code) return false;
  return /multipart|boundary|unexpected end of form|malformed|part terminated|unsupported content type/i.test(
    err.message,
  );
}

/** POST /api/admin/uploads (staff): multipart field `file` -> 201 {url, thumbnailUrl, width, height}; DELETE removes one. */
export function uploadAdminRoutes(images: ImageUploads, tempDir = path.join(os.tmpdir(), 'padside-uploads')): Router {
  const r = Router();
  r.post('/', requireRole('editor', 'treasurer', 'admin'), singleFile(tempDir), async function uploadImage(req, res) {
    if (!req.file) throw new AppError(400, 'missing_file', 'Choose an image to upload.', { file: 'Required.' });
    try {
      const stored = await images.store(
        { path: req.file.path, size: req.file.size, originalName: req.file.originalname },
        req.user!.id,
      );
      res.status(201).json(stored);
    } finally {
      await rm(req.file.path, { force: true });
    }
  });
  r.delete('/:key', requireRole('editor', 'treasurer', 'admin'), async function deleteImage(req, res) {
    const key = String(req.params.key);
    if (!STORAGE_KEY.test(key) || key.includes('-thumb')) throw notFound('No such image.');
    await images.remove(key);
    res.status(204).end();
  });
  return r;
}

/** GET /uploads/:key: streamed with the sniffed type and nosniff, never as HTML (ASVS 4.0.3 12.5.2). */
export function uploadServeRoutes(images: ImageUploads): Router {
  const r = Router();
  r.get('/:key', async function serveUpload(req, res) {
    const file = STORAGE_KEY.test(req.params.key) ? await images.read(req.params.key) : null;
    if (!file) throw notFound('No such file.');
    // Names are the hash of the uploaded bytes: what a name holds never changes.
    res.set({
      'Content-Type': file.contentType,
      'Content-Length': String(file.length),
      'X-Content-Type-Options': 'nosniff',
      'Content-Security-Policy': "default-src 'none'",
      'Cache-Control': 'public, max-age=31536000, immutable',
    });
    // A store failing half-way ends the response early; the client sees a cut-off image, not a wrong one.
    await pipeline(file.body, res).catch((err: unknown) => req.log?.warn({ err }, 'upload stream ended early'));
  });
  return r;
}
