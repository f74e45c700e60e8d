import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { parseBoardFile } from '../../../shared/board';
import { canonicalBoard } from '../../../shared/board';
import type { Services } from '../../services';
import type { BoardRegistry } from '../../boards-live';
import { boardRoleGuard } from '../middleware/board-role';
import { HttpError, badRequest } from '../errors';
import { requireUser } from '../middleware/require-user';

/** Largest board file accepted by import. */
export const MAX_IMPORT_BYTES = 2 * 1024 * 1024;

/** A file name from a title: lower-case words joined by dashes (`4-bit ripple counter` → `4-bit-ripple-counter`). */
export function slugify(title: string): string {
  const slug = title.toLowerCase().normalize('NFKD').replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 80);
  return slug || 'board';
}

const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: MAX_IMPORT_BYTES, files: 1 } });

/**
 * Upload errors are the client's: multer's own (413 for size, 400 for the rest) and the multipart
 * parser's (truncated body, missing or wrong boundary, malformed part header…), which carry no status.
 */
const singleFile: RequestHandler = (req, res, next) => {
  upload.single('file')(req, res, (err: unknown) => {
    if (!err) return next();
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') return next(new HttpError(413, 'too_large', `The board file is larger than ${MAX_IMPORT_BYTES / 1024 / 1024} MB`));
      return next(badRequest('invalid_input', `Upload one board file in the field "file" (${err.message})`, { file: err.message }));
    }
    const message = err instanceof Error ? err.message : String(err);
    next(badRequest('bad_upload', `The upload is not a readable multipart form (${message})`, { file: message }));
  });
};

/** `GET /api/boards/:id/export` and `POST /api/boards/import`. */
export function boardFileRouter(services: Services, boards: Pick<BoardRegistry, 'readBoardFile' | 'writeBoardFile'>): Router {
  const r = Router();
  const requireBoardRole = boardRoleGuard(services.authz);

  r.get('/boards/:id/export', requireBoardRole('viewer'), async (_req, res) => {
    const board = await services.boards.get(res.locals.boardId, res.locals.userId);
    const file = await boards.readBoardFile(res.locals.boardId);
    res.setHeader('Content-Disposition', `attachment; filename="${slugify(board.title)}.gatefold.json"`);
    res.type('application/json').send(JSON.stringify(file, null, 2) + '\n');
  });

  r.post('/boards/import', requireUser, singleFile, async (req, res) => {
    if (!req.file) throw badRequest('invalid_input', 'Choose a board file to import', { file: 'No file in the field "file"' });
    let raw: unknown;
    try {
      raw = JSON.parse(req.file.buffer.toString('utf8'));
    } catch (err) {
      throw badRequest('invalid_board', 'The file is not JSON', { file: (err as Error).message });
    }
    const parsed = parseBoardFile(raw);
    if (!parsed.ok) {
      const fields: Record<string, string> = {};
      for (const p of parsed.problems) {
        const key = p.id ?? p.path;
        if (!(key in fields)) fields[key] = p.message;
      }
      throw badRequest('invalid_board', `The board file has ${parsed.problems.length === 1 ? 'a problem' : `${parsed.problems.length} problems`}: ${parsed.problems[0].message}`, fields);
    }
    const file = canonicalBoard(parsed.board);
    const title = file.title.trim().slice(0, 200) || 'Imported board';
    const created = await services.boards.create(res.locals.userId, { title, family: file.family });
    await boards.writeBoardFile(created.id, file, res.locals.userId);
    res.status(201).json({ board: await services.boards.get(created.id, res.locals.userId) });
  });

  return r;
}
