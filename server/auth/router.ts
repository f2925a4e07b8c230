import { Router } from 'express';
import {
  changePasswordBodySchema,
  resetRequestBodySchema,
  setPasswordBodySchema,
  signInBodySchema,
} from '../../lib/schemas/auth';
import { parseBody } from '../http/validate';
import { publicBase, type AccountDeps } from './deps';
import { endSession, regenerateSession, saveSession } from './identity';
import { requireRoles } from './require-roles';
import { acceptInvitation, changePassword, completeReset, requestReset, signIn } from './service';
import { sessionCookieName } from './session';
import { sessionOnly } from './session-only';
import { accountAttemptLimiter } from './throttle';

/**
 * /auth: sign-in and sign-out (anyone), me and password change (any signed-in
 * person), invitation and password-reset completion (anyone holding a link).
 */
export function authRouter(deps: AccountDeps): Router {
  const router = Router();
  const limiter = accountAttemptLimiter(deps.config);

  router.post('/auth/sign-in', limiter, async (req, res) => {
    const body = parseBody(signInBodySchema, req);
    const me = await signIn(deps, body.email, body.password);
    await regenerateSession(req); // a fresh id: a planted session id is worthless
    const now = deps.now();
    req.session.userId = me.id;
    req.session.signedInAt = now;
    req.session.lastSeenAt = now;
    await saveSession(req);
    res.json(me);
  });

  router.post('/auth/sign-out', async (req, res) => {
    await endSession(req);
    res.clearCookie(sessionCookieName, { path: '/' });
    res.status(204).end();
  });

  router.get('/auth/me', requireRoles(), (req, res) => {
    const { id, email, displayName, roles } = req.user!;
    res.json({ id, email, displayName, roles });
  });

  router.put('/auth/password', requireRoles(), sessionOnly, async (req, res) => {
    const body = parseBody(changePasswordBodySchema, req);
    await changePassword(deps, req.user!.id, body.currentPassword, body.newPassword, req.sessionID);
    res.status(204).end();
  });

  router.post('/auth/invitation/accept', limiter, async (req, res) => {
    const body = parseBody(setPasswordBodySchema, req);
    res.json(await acceptInvitation(deps, body.token, body.password));
  });

  router.post('/auth/password-reset/request', limiter, async (req, res) => {
    const body = parseBody(resetRequestBodySchema, req);
    await requestReset(deps, body.email, publicBase(deps.config, req));
    res.status(202).json({ accepted: true });
  });

  router.post('/auth/password-reset/complete', limiter, async (req, res) => {
    const body = parseBody(setPasswordBodySchema, req);
    res.json(await completeReset(deps, body.token, body.password));
  });

  return router;
}
