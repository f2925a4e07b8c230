import { Router } from 'express';
import { deactivateBodySchema, inviteBodySchema, rolesBodySchema, userIdParamsSchema } from '../../lib/schemas/users';
import { publicBase, type AccountDeps } from '../auth/deps';
import { requireRoles } from '../auth/require-roles';
import { sessionOnly } from '../auth/session-only';
import { parseBody, parseParams } from '../http/validate';
import { allUsers, changeRoles, deactivate, invite } from './service';

/** /users — admin only, from a signed-in browser. */
export function usersRouter(deps: AccountDeps): Router {
  const router = Router();
  const guard = [requireRoles('admin'), sessionOnly];

  router.get('/users', ...guard, async (_req, res) => {
    res.json({ users: await allUsers(deps) });
  });

  router.post('/users', ...guard, async (req, res) => {
    const body = parseBody(inviteBodySchema, req);
    res.status(201).json(await invite(deps, req.user!.id, body, publicBase(deps.config, req)));
  });

  router.put('/users/:userId/roles', ...guard, async (req, res) => {
    const { userId } = parseParams(userIdParamsSchema, req);
    const body = parseBody(rolesBodySchema, req);
    res.json(await changeRoles(deps, req.user!.id, userId, body.roles));
  });

  router.post('/users/:userId/deactivate', ...guard, async (req, res) => {
    const { userId } = parseParams(userIdParamsSchema, req);
    const body = parseBody(deactivateBodySchema, req);
    res.json(await deactivate(deps, req.user!.id, userId, body.reason));
  });

  return router;
}
