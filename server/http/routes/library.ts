import { Router } from 'express';
import { z } from 'zod';
import { IdParamSchema, PublishLibraryModuleSchema } from '../../../shared/api';
import type { Services } from '../../services';
import { requireUser } from '../middleware/require-user';
import { parseInput } from '../errors';

const EntryParams = z.object({ id: IdParamSchema });

/**
 * The team library (decision 004): a board owner's library of modules, read by the members of the
 * owner's boards. `GET /api/library`, `POST /api/library` `{boardId, moduleId}` (publish from a board the
 * caller can edit), `GET /api/library/:id` (the content in the board file's module shape, for the
 * add-modules edit), `DELETE /api/library/:id` (the library's owner only).
 */
export function libraryRouter(services: Services): Router {
  const r = Router();

  r.get('/library', requireUser, async (_req, res) => {
    res.json({ modules: await services.library.list(res.locals.userId) });
  });

  r.post('/library', requireUser, async (req, res) => {
    const body = parseInput(PublishLibraryModuleSchema, req.body);
    const { entry, created } = await services.library.publish(res.locals.userId, body);
    res.status(created ? 201 : 200).json({ module: entry });
  });

  r.get('/library/:id', requireUser, async (req, res) => {
    const { id } = parseInput(EntryParams, req.params);
    res.json({ module: await services.library.get(res.locals.userId, id) });
  });

  r.delete('/library/:id', requireUser, async (req, res) => {
    const { id } = parseInput(EntryParams, req.params);
    await services.library.remove(res.locals.userId, id);
    res.status(204).end();
  });

  return r;
}
