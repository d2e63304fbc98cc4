import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { AppError, notFound } from '../platform/app-error';
import { requireRole } from '../platform/require-role';
import { ImageUploads, MAX_IMAGE_BYTES } from './image-uploads';

/** multer with a byte limit (ASVS 4.0.3 12.1.1); its errors become our 4xx. */
const singleFile: RequestHandler = (req, res, next) => {
  multer({ storage: multer.memoryStorage(), limits: { fileSize: MAX_IMAGE_BYTES, files: 1 } }).single('file')(req, res, (err: unknown) => {
    if (err instanceof multer.MulterError) {
      return next(err.code === 'LIMIT_FILE_SIZE' ? new AppError(413, 'file_too_large', `Images can be at most ${MAX_IMAGE_BYTES / 1024 / 1024} MB.`, { file: 'Too large.' }) : new AppError(400, 'bad_upload', err.message, { file: err.message }));
    }
    next(err);
  });
};

/** POST /api/admin/uploads (staff): multipart field `file` -> 201 {url, thumbnailUrl, width, height}. */
export function uploadAdminRoutes(images: ImageUploads): Router {
  const r = Router();
  r.post('/', requireRole('editor', 'treasurer', 'admin'), singleFile, async function uploadImage(req, res) {
    if (!req.file) throw new AppError(400, 'missing_file', 'Choose an image to upload.', { file: 'Required.' });
    const stored = await images.store(req.file.buffer, req.file.originalname, req.user!.id);
    res.status(201).json(stored);
  });
  return r;
}

/** GET /uploads/:key: served with the sniffed type and nosniff, never as HTML (ASVS 4.0.3 12.5.2). */
export function uploadServeRoutes(images: ImageUploads): Router {
  const r = Router();
  r.get('/:key', async function serveUpload(req, res) {
    const file = /^[a-z0-9-]+\.(jpg|png|webp|gif)$/.test(req.params.key) ? await images.read(req.params.key) : null;
    if (!file) throw notFound('No such file.');
    res.set({ 'Content-Type': file.contentType, 'X-Content-Type-Options': 'nosniff', 'Content-Security-Policy': "default-src 'none'", 'Cache-Control': 'public, max-age=31536000, immutable' });
    res.send(file.bytes);
  });
  return r;
}
