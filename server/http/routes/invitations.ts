import { Router } from 'express';
import { z } from 'zod';
import type { Services } from '../../services';
import { parseInput } from '../errors';
import { requireUser } from '../middleware/require-user';

const TokenParams = z.object({ token: z.string().min(1, 'Malformed invitation token').max(200, 'Malformed invitation token') });

export function invitationsRouter(services: Services): Router {
  const r = Router();

  r.get('/invitations/:token', async (req, res) => {
    const { token } = parseInput(TokenParams, req.params);
    res.json({ invitation: await services.invitations.info(token) });
  });

  r.post('/invitations/:token/accept', requireUser, async (req, res) => {
    const { token } = parseInput(TokenParams, req.params);
    res.json({ board: await services.invitations.accept(token, res.locals.userId) });
  });

  return r;
}
