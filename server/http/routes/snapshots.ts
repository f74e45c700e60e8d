import { Router } from 'express';
import { CopyBoardSchema, CreateSnapshotSchema, IdParamSchema, RenameSnapshotSchema } from '../../../shared/api';
import type { Services } from '../../services';
import type { SnapshotsService } from '../../snapshots';
import { boardRoleGuard } from '../middleware/board-role';
import { badRequest, parseInput } from '../errors';

/** `:sid` of the path, or 400 with the field. */
function snapshotId(raw: unknown): number {
  const parsed = IdParamSchema.safeParse(raw);
  if (!parsed.success) throw badRequest('invalid_input', 'The snapshot id must be a positive whole number', { sid: parsed.error.issues[0]?.message ?? 'Invalid id' });
  return parsed.data;
}

/**
 * A board's history (CONTRACTS §3): viewers list, preview, compare and copy; editors also take and
 * rename; only the owner restores and deletes. A snapshot id of another board is 404.
 */
export function snapshotsRouter(services: Services, snapshots: SnapshotsService): Router {
  const r = Router();
  const requireBoardRole = boardRoleGuard(services.authz);

  r.get('/boards/:id/snapshots', requireBoardRole('viewer'), async (_req, res) => {
    res.json({ snapshots: await snapshots.list(res.locals.boardId) });
  });

  r.post('/boards/:id/snapshots', requireBoardRole('editor'), async (req, res) => {
    const body = parseInput(CreateSnapshotSchema, req.body);
    res.status(201).json({ snapshot: await snapshots.take(res.locals.boardId, { kind: 'named', name: body.name, authorId: res.locals.userId }) });
  });

  r.get('/boards/:id/snapshots/:sid', requireBoardRole('viewer'), async (req, res) => {
    res.json(await snapshots.get(res.locals.boardId, snapshotId(req.params.sid)));
  });

  r.get('/boards/:id/snapshots/:sid/thumbnail.svg', requireBoardRole('viewer'), async (req, res) => {
    const svg = await snapshots.thumbnail(res.locals.boardId, snapshotId(req.params.sid));
    res.setHeader('Cache-Control', 'private, max-age=3600');
    res.setHeader('Content-Security-Policy', "default-src 'none'; style-src 'unsafe-inline'");
    res.type('image/svg+xml').send(svg);
  });

  r.patch('/boards/:id/snapshots/:sid', requireBoardRole('editor'), async (req, res) => {
    const body = parseInput(RenameSnapshotSchema, req.body);
    res.json({ snapshot: await snapshots.rename(res.locals.boardId, snapshotId(req.params.sid), body.name) });
  });

  r.delete('/boards/:id/snapshots/:sid', requireBoardRole('owner'), async (req, res) => {
    await snapshots.remove(res.locals.boardId, snapshotId(req.params.sid));
    res.status(204).end();
  });

  r.post('/boards/:id/snapshots/:sid/restore', requireBoardRole('owner'), async (req, res) => {
    res.json(await snapshots.restore(res.locals.boardId, snapshotId(req.params.sid), res.locals.userId));
  });

  r.get('/boards/:id/snapshots/:sid/compare', requireBoardRole('viewer'), async (req, res) => {
    res.json(await snapshots.compare(res.locals.boardId, snapshotId(req.params.sid)));
  });

  r.post('/boards/:id/copy', requireBoardRole('viewer'), async (req, res) => {
    const body = parseInput(CopyBoardSchema, req.body);
    res.status(201).json({ board: await snapshots.copy(res.locals.boardId, res.locals.userId, body.snapshotId) });
  });

  return r;
}
