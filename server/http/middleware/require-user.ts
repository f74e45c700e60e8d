import type { Request, RequestHandler } from 'express';
import { forbidden, notSignedIn } from '../errors';
import type { UsersService } from '../../services/users';

/** The signed-in user's id, or throws 401 `not_signed_in`. */
export function userIdOf(req: Request): number {
  const id = req.session?.userId;
  if (!id) throw notSignedIn();
  return id;
}

/** 401 unless signed in; puts the id on `res.locals.userId`. */
export const requireUser: RequestHandler = (req, res, next) => {
  res.locals.userId = userIdOf(req);
  next();
};

/** 401 unless signed in, 403 `admin_only` unless a site admin. */
export function requireAdmin(users: UsersService): RequestHandler {
  return async (req, res, next) => {
    const user = await users.getById(userIdOf(req));
    if (!user) throw notSignedIn();
    if (!user.isAdmin) throw forbidden('admin_only', 'Only a site admin can do this');
    res.locals.userId = user.id;
    next();
  };
}
