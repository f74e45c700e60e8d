import { Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import { z } from 'zod';
import { IdParamSchema } from '../../../shared/api';
import { boardOf, BringupError, type Observation } from '../../../shared/bringup';
import type { Services } from '../../services';
import type { BringupService } from '../../services/bringup';
import type { PhotosService } from '../../services/photos';
import { boardRoleGuard } from '../middleware/board-role';
import { requireUser } from '../middleware/require-user';
import { HttpError, badRequest, parseInput } from '../errors';
import { photosRouter } from './photos';

const OutputsSchema = z.union([z.string().transform((s) => s.split(',').map((x) => x.trim()).filter(Boolean)), z.array(z.string().min(1))]).optional();
const ObservationSchema = z.object({ in: z.string().min(1).max(64), out: z.string().min(1).max(64) });
const DiagnoseBodySchema = z.object({ observed: z.array(ObservationSchema).min(1).max(10000), outputs: OutputsSchema });
const RecordSchema = z.object({
  in: z.string().regex(/^[01]{1,64}$/, 'switch settings: characters 0 or 1'),
  out: z.string().regex(/^[01?]{1,64}$/, 'lamps: characters 0, 1 or ? (not read)'),
  step: z.number().int().min(0).max(100000).nullable().optional(),
});

/** The board file of a body (`{board, …}` or the file itself), or 400 naming the problem. */
function boardFromBody(body: unknown) {
  if (!body || typeof body !== 'object' || Array.isArray(body)) throw badRequest('invalid_board', 'Send a board file as the JSON body', { _: 'not an object' });
  const b = body as Record<string, unknown>;
  const raw = b.board && typeof b.board === 'object' ? b.board : b;
  try {
    return boardOf(raw);
  } catch (err) {
    if (err instanceof BringupError) throw badRequest('invalid_board', err.message, { [err.field ?? 'board']: err.message });
    throw err;
  }
}

/**
 * Bring-up (CONTRACTS §2 JSON over HTTP): `POST /api/test-vectors` and `POST /api/diagnose` for a board
 * file; a board's bring-up under `/api/boards/:id/bringup` (viewers read, editors record, the owner
 * clears); and the build photos (photos.ts).
 */
export function bringupRouter(services: Services, deps: { bringup: BringupService; photos: PhotosService }): Router {
  const r = Router();
  const { bringup } = deps;
  const requireBoardRole = boardRoleGuard(services.authz);
  // a large board's vectors keep a core busy for a second: bound how often one account asks
  const limit = rateLimit({
    windowMs: 60_000, limit: 60, standardHeaders: 'draft-7', legacyHeaders: false,
    keyGenerator: (req) => `user:${String(req.session?.userId ?? 'none')}`,
    handler: (_req, _res, next) => next(new HttpError(429, 'too_many_attempts', 'Too many bring-up requests in a minute; wait a moment')),
  });

  r.post('/test-vectors', requireUser, limit, (req, res) => {
    const board = boardFromBody(req.body);
    const outputs = parseInput(z.object({ outputs: OutputsSchema }), { outputs: (req.body as { outputs?: unknown }).outputs }).outputs;
    res.json(bringup.vectors(board, outputs));
  });

  r.post('/diagnose', requireUser, limit, (req, res) => {
    const board = boardFromBody(req.body);
    const body = parseInput(DiagnoseBodySchema, req.body);
    res.json(bringup.diagnose(board, body.observed as Observation[], body.outputs));
  });

  r.get('/boards/:id/bringup', requireBoardRole('viewer'), limit, async (_req, res) => {
    res.json(await bringup.summary(res.locals.boardId));
  });

  r.get('/boards/:id/bringup/observations', requireBoardRole('viewer'), async (_req, res) => {
    res.json({ observations: await bringup.list(res.locals.boardId) });
  });

  r.post('/boards/:id/bringup/observations', requireBoardRole('editor'), async (req, res) => {
    const body = parseInput(RecordSchema, req.body);
    res.status(201).json({ observation: await bringup.record(res.locals.boardId, res.locals.userId, body) });
  });

  r.delete('/boards/:id/bringup/observations/:oid', requireBoardRole('editor'), async (req, res) => {
    const parsed = IdParamSchema.safeParse(req.params.oid);
    if (!parsed.success) throw badRequest('invalid_input', 'The observation id must be a positive whole number', { oid: 'Invalid id' });
    await bringup.remove(res.locals.boardId, parsed.data, res.locals.userId, res.locals.boardRole);
    res.status(204).end();
  });

  r.delete('/boards/:id/bringup/observations', requireBoardRole('owner'), async (_req, res) => {
    await bringup.clear(res.locals.boardId);
    res.status(204).end();
  });

  r.use(photosRouter(services, deps.photos));
  return r;
}
