import { rateLimit, type Options, type Store } from 'express-rate-limit';
import type { Request, RequestHandler } from 'express';
import type { AppConfig } from '../../config';
import { HttpError } from '../errors';

type Key = Options['keyGenerator'];

function minutes(ms: number): string {
  const m = Math.ceil(ms / 60000);
  return m === 1 ? '1 minute' : `${m} minutes`;
}

/**
 * One limiter answering 429 `too_many_attempts` in the contract's error shape. The key is the client
 * address (`req.ip`: the socket's address unless TRUST_PROXY says which proxies to believe) unless
 * `key` says otherwise.
 */
function limiter(p: { windowMs: number; limit: number; what: string; skipSuccessfulRequests?: boolean; skipFailedRequests?: boolean; key?: Key; store?: Store }): RequestHandler {
  return rateLimit({
    windowMs: p.windowMs,
    limit: p.limit,
    skipSuccessfulRequests: p.skipSuccessfulRequests ?? false,
    skipFailedRequests: p.skipFailedRequests ?? false,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    // X-Forwarded-For from a client is expected noise: only TRUST_PROXY decides whether it is read
    validate: { xForwardedForHeader: false },
    ...(p.key ? { keyGenerator: p.key } : {}),
    ...(p.store ? { store: p.store } : {}),
    handler: (_req, _res, next) => {
      next(new HttpError(429, 'too_many_attempts', `Too many ${p.what}; wait ${minutes(p.windowMs)} and try again`));
    },
  });
}

/** The account a sign-in is for: the e-mail of the body, as the login schema compares it. */
function accountKey(req: Request): string {
  const email = (req.body as { email?: unknown } | undefined)?.email;
  return `account:${typeof email === 'string' ? email.trim().toLowerCase() : ''}`;
}

/** The signed-in account (the limiter runs after requireUser / the board role check). */
const userKey = (req: Request) => `user:${String(req.session?.userId ?? 'none')}`;

/**
 * The limits of the password-guessing, account-creation and mail-sending routes (sizes from config).
 * Sign-in is limited twice, and only failures count: strictly per account (guessing one password) and
 * generously per address (spraying many accounts), so a classroom behind one address keeps signing in.
 * `shared(name)` gives a store every server shares (Redis, with several servers); default: in memory.
 */
export function createRateLimits(config: AppConfig, shared?: (name: string) => Store) {
  const { windowMs } = config.rateLimit;
  const rl = config.rateLimit;
  const store = (name: string) => shared?.(name);
  return {
    loginPerAccount: limiter({ windowMs, limit: rl.login, what: 'failed sign-ins for this account', skipSuccessfulRequests: true, key: accountKey, store: store('login-account') }),
    loginPerAddress: limiter({ windowMs, limit: rl.loginPerAddress, what: 'failed sign-ins from your address', skipSuccessfulRequests: true, store: store('login-address') }),
    signup: limiter({ windowMs, limit: rl.signup, what: 'sign-ups from your address', store: store('signup') }),
    resetRequest: limiter({ windowMs, limit: rl.resetRequest, what: 'reset requests', store: store('reset') }),
    invitations: limiter({ windowMs: rl.invitationsWindowMs, limit: rl.invitations, what: 'members added or invited', skipFailedRequests: true, key: userKey, store: store('invitations') }),
  };
}

export type RateLimits = ReturnType<typeof createRateLimits>;
