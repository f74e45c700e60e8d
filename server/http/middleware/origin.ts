import type { Request, RequestHandler } from 'express';
import type { AppConfig } from '../../config';
import { HttpError, forbidden } from '../errors';

/** The hosts the server answers to by default: the loopback names (and HOST) on the port the request came in on. */
function defaultHosts(req: Request, config: Pick<AppConfig, 'host'>): string[] {
  const port = req.socket.localPort;
  const names = ['localhost', '127.0.0.1', '[::1]'];
  if (config.host && !['0.0.0.0', '::'].includes(config.host)) names.push(config.host.includes(':') ? `[${config.host}]` : config.host);
  const hosts = names.map((n) => `${n.toLowerCase()}:${port}`);
  // A browser leaves the port out of Host when it is the scheme's default.
  if (port === 80 || port === 443) hosts.push(...names.map((n) => n.toLowerCase()));
  return hosts;
}

/** True when the request's Host header is one the server may put into e-mailed links. */
export function hostAllowed(req: Request, config: Pick<AppConfig, 'allowedHosts' | 'host'>): boolean {
  // req.host is the Host header, or X-Forwarded-Host only from a proxy TRUST_PROXY names.
  const host = req.host?.trim().toLowerCase();
  if (!host) return false;
  return (config.allowedHosts ?? defaultHosts(req, config)).includes(host);
}

/**
 * The origin to put into e-mailed links: PUBLIC_URL, or else the request's scheme and Host when that Host
 * is allowed (ALLOWED_HOSTS, default the listening host). Any other Host is refused with 400
 * `host_not_allowed`, so a forged Host header never ends up in a mailed link.
 */
export function linkOrigin(req: Request, config: AppConfig): string {
  if (config.publicUrl) return config.publicUrl;
  if (!hostAllowed(req, config)) {
    throw new HttpError(400, 'host_not_allowed', 'This server does not send links for that host name; set PUBLIC_URL or ALLOWED_HOSTS', { host: req.host ?? '' });
  }
  return `${req.protocol}://${req.host!.trim().toLowerCase()}`;
}

/** Middleware form of `linkOrigin`: checks the Host before the route does anything, puts the origin on `res.locals.linkOrigin`. */
export function requireLinkOrigin(config: AppConfig): RequestHandler {
  return (req, res, next) => {
    res.locals.linkOrigin = linkOrigin(req, config);
    next();
  };
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
