import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { IdParamSchema } from '../../../shared/api';
import type { Services } from '../../services';
import { MAX_PHOTO_BYTES, type PhotosService } from '../../services/photos';
import { boardRoleGuard } from '../middleware/board-role';
import { HttpError, badRequest, notFound } from '../errors';

const upload = multer({ storage: multer.memoryStorage(), preservePath: true, limits: { fileSize: MAX_PHOTO_BYTES, files: 1, fields: 4, fieldSize: 1024 } });

/** Upload errors are the client's (the same mapping as the board import): 413 for size, 400 for the rest. */
const singlePhoto: RequestHandler = (req, res, next) => {
  upload.single('file')(req, res, (err: unknown) => {
    if (!err) return next();
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') return next(new HttpError(413, 'too_large', `The photo is larger than ${MAX_PHOTO_BYTES / 1024 / 1024} MB`));
      return next(badRequest('invalid_input', `Upload one photo in the field "file" (${err.message})`, { file: err.message }));
    }
    const message = err instanceof Error ? err.message : String(err);
    next(badRequest('bad_upload', `The upload is not a readable multipart form (${message})`, { file: message }));
  });
};

function photoId(raw: unknown): number {
  const parsed = IdParamSchema.safeParse(raw);
  if (!parsed.success) throw badRequest('invalid_input', 'The photo id must be a positive whole number', { pid: parsed.error.issues[0]?.message ?? 'Invalid id' });
  return parsed.data;
}

/**
 * Build photos (CONTRACTS §3 `GET|POST /api/boards/:id/photos`): members see them, editors upload
 * (multipart field `file`, optional `partId`, `caption`) → 201 `{photo}`, the uploader or the owner
 * deletes. Files are served only through these routes (never a public folder).
 */
export function photosRouter(services: Services, photos: PhotosService): Router {
  const r = Router();
  const requireBoardRole = boardRoleGuard(services.authz);

  r.get('/boards/:id/photos', requireBoardRole('viewer'), async (_req, res) => {
    res.json({ photos: await photos.list(res.locals.boardId) });
  });

  // the role is checked before the body is read: a viewer's or stranger's upload is never parsed
  r.post('/boards/:id/photos', requireBoardRole('editor'), singlePhoto, async (req, res) => {
    if (!req.file) throw badRequest('invalid_input', 'Choose a photo to upload', { file: 'No file in the field "file"' });
    const body = (req.body ?? {}) as Record<string, unknown>;
    const text = (v: unknown) => (typeof v === 'string' ? v : undefined);
    const photo = await photos.upload(res.locals.boardId, res.locals.userId, {
      buffer: req.file.buffer, originalname: req.file.originalname, partId: text(body.partId), caption: text(body.caption),
    });
    res.status(201).json({ photo });
  });

  for (const which of ['file', 'thumb'] as const) {
    r.get(`/boards/:id/photos/:pid/${which}`, requireBoardRole('viewer'), async (req, res, next) => {
      const f = await photos.file(res.locals.boardId, photoId(req.params.pid), which);
      res.setHeader('Cache-Control', 'private, max-age=86400');
      res.setHeader('X-Content-Type-Options', 'nosniff');
      res.setHeader('Content-Security-Policy', "default-src 'none'");
      res.type(f.mime);
      res.sendFile(f.path, (err) => {
        if (err && !res.headersSent) next(notFound('photo_not_found', 'The photo file is missing'));
      });
    });
  }

  r.delete('/boards/:id/photos/:pid', requireBoardRole('editor'), async (req, res) => {
    await photos.remove(res.locals.boardId, photoId(req.params.pid), res.locals.userId, res.locals.boardRole);
    res.status(204).end();
  });

  return r;
}
