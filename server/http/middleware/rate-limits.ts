import { rateLimit } from 'express-rate-limit';
import type { RequestHandler } from 'express';
import type { AppConfig } from '../../config';
import { HttpError } from '../errors';

function limiter(windowMs: number, limit: number, what: string, skipSuccessfulRequests: boolean): RequestHandler {
  return rateLimit({
    windowMs,
    limit,
    skipSuccessfulRequests,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    handler: (_req, _res, next) => {
      next(new HttpError(429, 'too_many_attempts', `Too many ${what}; wait ${Math.ceil(windowMs / 60000)} minutes and try again`));
    },
  });
}

/** Per-address limits on the password-guessing and account-creation routes (sizes from config). */
export function createRateLimits(config: AppConfig) {
  const { windowMs } = config.rateLimit;
  return {
    // Only failed sign-ins count, so a classroom behind one address can still sign in.
    login: limiter(windowMs, config.rateLimit.login, 'sign-in attempts', true),
    signup: limiter(windowMs, config.rateLimit.signup, 'sign-ups', false),
    resetRequest: limiter(windowMs, config.rateLimit.resetRequest, 'reset requests', false),
  };
}
