import type { Request, RequestHandler } from 'express';
import { HttpError } from '../http/errors';
import { userForToken } from '../tokens/service';
import type { AccountDeps } from './deps';
import { findUserById, rolesOf } from './repo';

/**
 * Establishes `req.user`: from `Authorization: Bearer <token>` when present
 * (a bad token is a 401, never a silent fall-back), otherwise from the
 * session. A session past its idle or absolute limit, or of a deactivated
 * account, is destroyed and the request continues anonymously.
 */
export function identify(deps: AccountDeps): RequestHandler {
  return async (req, _res, next) => {
    try {
      const bearer = /^Bearer\s+(\S+)$/i.exec(req.get('authorization') ?? '')?.[1];
      if (bearer) {
        const user = await userForToken(deps, bearer);
        if (!user) throw new HttpError(401, 'bad-token', 'This API token is unknown, revoked, or belongs to a deactivated account.');
        req.user = user;
        return next();
      }
      const s = req.session;
      if (s?.userId === undefined) return next();
      const now = deps.now();
      const expired =
        now - (s.lastSeenAt ?? 0) > deps.config.session.idleMs || now - (s.signedInAt ?? 0) > deps.config.session.absoluteMs;
      const user = expired ? undefined : await findUserById(deps.db, s.userId);
      if (!user || !user.active) {
        await endSession(req);
        return next();
      }
      s.lastSeenAt = now;
      req.user = {
        id: user.id,
        email: user.email,
        displayName: user.display_name,
        roles: await rolesOf(deps.db, user.id),
        via: 'session',
      };
      next();
    } catch (err) {
      next(err);
    }
  };
}

export function endSession(req: Request): Promise<void> {
  return new Promise((resolve, reject) => {
    if (!req.session) return resolve();
    req.session.destroy((err) => (err ? reject(err) : resolve()));
  });
}

export function regenerateSession(req: Request): Promise<void> {
  return new Promise((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
}

export function saveSession(req: Request): Promise<void> {
  return new Promise((resolve, reject) => req.session.save((err) => (err ? reject(err) : resolve())));
}
