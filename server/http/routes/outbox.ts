import { Router } from 'express';
import { z } from 'zod';
import { IdParamSchema } from '../../../shared/api';
import type { Services } from '../../services';
import { parseInput } from '../errors';
import { requireAdmin } from '../middleware/require-user';

const MessageParams = z.object({ id: IdParamSchema });

/** The admin's view of every message the built-in SMTP catcher received. */
export function outboxRouter(services: Services): Router {
  const r = Router();
  const admin = requireAdmin(services.users);

  r.get('/admin/outbox', admin, async (_req, res) => {
    res.json({ messages: await services.outbox.list() });
  });

  r.get('/admin/outbox/:id', admin, async (req, res) => {
    const { id } = parseInput(MessageParams, req.params);
    res.json({ message: await services.outbox.get(id) });
  });

  return r;
}
