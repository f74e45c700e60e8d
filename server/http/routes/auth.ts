import { Router, type Request } from 'express';
import { LoginSchema, ResetRequestSchema, ResetSchema, SignupSchema } from '../../../shared/api';
import type { AppConfig } from '../../config';
import type { Services } from '../../services';
import { notSignedIn, parseInput } from '../errors';
import { SESSION_COOKIE } from '../middleware/session';
import { requireLinkOrigin } from '../middleware/origin';
import type { RateLimits } from '../middleware/rate-limits';

/** New session id for the signed-in user (no session fixation), saved before we answer. */
async function signIn(req: Request, userId: number): Promise<void> {
  await new Promise<void>((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
  req.session.userId = userId;
  await new Promise<void>((resolve, reject) => req.session.save((err) => (err ? reject(err) : resolve())));
}

export function authRouter(services: Services, config: AppConfig, limits: RateLimits): Router {
  const r = Router();

  r.post('/auth/signup', limits.signup, async (req, res) => {
    const body = parseInput(SignupSchema, req.body);
    const user = await services.auth.signUp(body);
    await signIn(req, user.id);
    res.status(201).json({ user });
  });

  // Failed sign-ins count per address (generous) and per account (strict); correct ones never count.
  r.post('/auth/login', limits.loginPerAddress, limits.loginPerAccount, async (req, res) => {
    const body = parseInput(LoginSchema, req.body);
    const user = await services.auth.logIn(body);
    await signIn(req, user.id);
    res.json({ user });
  });

  r.post('/auth/logout', async (req, res) => {
    const userId = req.session?.userId;
    const sessionId = req.sessionID;
    if (req.session) await new Promise<void>((resolve, reject) => req.session.destroy((err) => (err ? reject(err) : resolve())));
    res.clearCookie(SESSION_COOKIE, { path: '/', httpOnly: true, sameSite: 'lax' });
    if (userId) services.auth.signedOut(userId, sessionId);
    res.status(204).end();
  });

  r.get('/auth/me', async (req, res) => {
    const id = req.session?.userId;
    const user = id ? await services.users.getById(id) : undefined;
    if (!user) throw notSignedIn();
    res.json({ user });
  });

  // The Host is checked before the address is looked at, so the answer says nothing about the account.
  r.post('/auth/reset-request', limits.resetRequest, requireLinkOrigin(config), async (req, res) => {
    const { email } = parseInput(ResetRequestSchema, req.body);
    await services.auth.requestReset(email, res.locals.linkOrigin as string);
    res.status(202).json({ ok: true });
  });

  r.post('/auth/reset', limits.resetRequest, async (req, res) => {
    const body = parseInput(ResetSchema, req.body);
    await services.auth.resetPassword(body, req.sessionID);
    res.json({ ok: true });
  });

  return r;
}
