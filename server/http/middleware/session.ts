import session from 'express-session';
import type { RequestHandler } from 'express';
import type { AppConfig } from '../../config';

declare module 'express-session' {
  interface SessionData {
    /** The signed-in user; absent for anonymous sessions. */
    userId?: number;
  }
}

/** Name of the session cookie (CONTRACTS §3). */
export const SESSION_COOKIE = 'gatefold.sid';

/**
 * Session middleware over `store`. Exposed on the app context so the websocket upgrade can run the very
 * same middleware on its request and read `req.session.userId`.
 */
export function createSessionMiddleware(config: AppConfig, store: session.Store): RequestHandler {
  const secure = config.publicUrl?.startsWith('https:') ?? false;
  return session({
    name: SESSION_COOKIE,
    secret: config.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    proxy: secure ? true : undefined,
    cookie: { httpOnly: true, sameSite: 'lax', secure, maxAge: 30 * 24 * 60 * 60 * 1000, path: '/' },
  });
}
