import type { Request, RequestHandler } from 'express';
import type { AppConfig } from '../../config';
import { forbidden } from '../errors';

/** The server's own origin as the browser sees it: PUBLIC_URL, or the request's scheme and Host. */
export function requestOrigin(req: Request, config: AppConfig): string {
  return config.publicUrl ?? `${req.protocol}://${req.get('host') ?? 'localhost'}`;
}

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Cross-site request forgery guard: every state-changing request must carry an Origin (or, failing
 * that, a Referer) equal to our own origin or PUBLIC_URL. Browsers always send Origin on such requests.
 */
export function originCheck(config: AppConfig): RequestHandler {
  return (req, _res, next) => {
    if (SAFE.has(req.method)) return next();
    let origin = req.get('origin');
    if (!origin) {
      const referer = req.get('referer');
      try {
        origin = referer ? new URL(referer).origin : undefined;
      } catch {
        origin = undefined;
      }
    }
    const allowed = new Set([`${req.protocol}://${req.get('host')}`]);
    if (config.publicUrl) allowed.add(config.publicUrl);
    if (!origin || !allowed.has(origin)) {
      return next(forbidden('bad_origin', origin ? `Requests from ${origin} are not accepted` : 'The request has no Origin header'));
    }
    next();
  };
}
