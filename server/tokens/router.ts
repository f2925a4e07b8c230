import { Router } from 'express';
import { createTokenBodySchema, tokenIdParamsSchema } from '../../lib/schemas/tokens';
import type { AccountDeps } from '../auth/deps';
import { requireRoles } from '../auth/require-roles';
import { sessionOnly } from '../auth/session-only';
import { parseBody, parseParams } from '../http/validate';
import { createToken, listTokens, revokeToken } from './service';

/** /tokens — analysts manage their own personal API tokens, from a signed-in browser. */
export function tokensRouter(deps: AccountDeps): Router {
  const router = Router();
  const guard = [requireRoles('analyst'), sessionOnly];

  router.get('/tokens', ...guard, async (req, res) => {
    res.json({ tokens: await listTokens(deps, req.user!.id) });
  });

  router.post('/tokens', ...guard, async (req, res) => {
    const body = parseBody(createTokenBodySchema, req);
    res.status(201).json(await createToken(deps, req.user!.id, body.name));
  });

  router.delete('/tokens/:tokenId', ...guard, async (req, res) => {
    const { tokenId } = parseParams(tokenIdParamsSchema, req);
    await revokeToken(deps, req.user!.id, tokenId);
    res.status(204).end();
  });

  return router;
}
