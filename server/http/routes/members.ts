import { Router } from 'express';
import { z } from 'zod';
import { AddMemberSchema, IdParamSchema, UpdateMemberSchema } from '../../../shared/api';
import type { AppConfig } from '../../config';
import type { Services } from '../../services';
import { boardRoleGuard } from '../middleware/board-role';
import { parseInput } from '../errors';
import { requireLinkOrigin } from '../middleware/origin';
import type { RateLimits } from '../middleware/rate-limits';

const UserParams = z.object({ userId: IdParamSchema });
const InvitationParams = z.object({ invitationId: IdParamSchema });

export function membersRouter(services: Services, config: AppConfig, limits: Pick<RateLimits, 'invitations'>): Router {
  const r = Router();
  const requireBoardRole = boardRoleGuard(services.authz);

  // E-mail addresses only for the owner; others see names and roles.
  r.get('/boards/:id/members', requireBoardRole('viewer'), async (_req, res) => {
    res.json(await services.members.list(res.locals.boardId, res.locals.boardRole, res.locals.userId));
  });

  // Each addition sends an e-mail: limited per account, and the link's host is checked first.
  r.post('/boards/:id/members', requireBoardRole('owner'), limits.invitations, requireLinkOrigin(config), async (req, res) => {
    const body = parseInput(AddMemberSchema, req.body);
    res.status(201).json(await services.members.add(res.locals.boardId, res.locals.userId, body, res.locals.linkOrigin as string));
  });

  r.patch('/boards/:id/members/:userId', requireBoardRole('owner'), async (req, res) => {
    const { userId } = parseInput(UserParams, req.params);
    const { role } = parseInput(UpdateMemberSchema, req.body);
    res.json({ member: await services.members.changeRole(res.locals.boardId, userId, role) });
  });

  // Any member may leave; only the owner may remove someone else (checked in the service).
  r.delete('/boards/:id/members/:userId', requireBoardRole('viewer'), async (req, res) => {
    const { userId } = parseInput(UserParams, req.params);
    await services.members.remove(res.locals.boardId, userId, res.locals.userId, res.locals.boardRole);
    res.status(204).end();
  });

  r.delete('/boards/:id/invitations/:invitationId', requireBoardRole('owner'), async (req, res) => {
    const { invitationId } = parseInput(InvitationParams, req.params);
    await services.invitations.revoke(res.locals.boardId, invitationId);
    res.status(204).end();
  });

  return r;
}
