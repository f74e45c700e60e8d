import { Router } from 'express';
import { CreateBoardSchema, UpdateBoardSchema } from '../../../shared/api';
import type { Services } from '../../services';
import { boardRoleGuard } from '../middleware/board-role';
import { parseInput } from '../errors';
import { requireUser } from '../middleware/require-user';

export function boardsRouter(services: Services): Router {
  const r = Router();
  const requireBoardRole = boardRoleGuard(services.authz);

  r.get('/boards', requireUser, async (_req, res) => {
    res.json({ boards: await services.boards.list(res.locals.userId) });
  });

  r.post('/boards', requireUser, async (req, res) => {
    const body = parseInput(CreateBoardSchema, req.body);
    res.status(201).json({ board: await services.boards.create(res.locals.userId, body) });
  });

  r.get('/boards/:id', requireBoardRole('viewer'), async (_req, res) => {
    res.json({ board: await services.boards.get(res.locals.boardId, res.locals.userId) });
  });

  r.patch('/boards/:id', requireBoardRole('editor'), async (req, res) => {
    const body = parseInput(UpdateBoardSchema, req.body);
    res.json({ board: await services.boards.update(res.locals.boardId, res.locals.userId, body) });
  });

  r.delete('/boards/:id', requireBoardRole('owner'), async (_req, res) => {
    await services.boards.remove(res.locals.boardId);
    res.status(204).end();
  });

  return r;
}
