import type { RequestHandler } from 'express';
import type { Role } from '../../lib/schemas/roles';
import { HttpError } from '../http/errors';

/** Who is asking, as the session or an API token established it. */
export interface RequestUser {
  id: number;
  email: string;
  displayName: string;
  roles: Role[];
  /** 'session' for a signed-in browser, 'token' for a personal API token. */
  via: 'session' | 'token';
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      user?: RequestUser;
    }
  }
}

/**
 * Lets the request through when the caller is signed in and holds at least
 * one of `allowed` (any signed-in user when `allowed` is empty): 401 when
 * nobody is signed in, 403 when the roles do not fit.
 */
export function requireRoles(...allowed: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(new HttpError(401, 'unauthenticated', 'Sign in to continue.'));
    if (allowed.length > 0 && !req.user.roles.some((r) => allowed.includes(r))) {
      return next(
        new HttpError(403, 'forbidden', `This needs the ${allowed.join(' or ')} role; your account does not hold it.`),
      );
    }
    next();
  };
}
