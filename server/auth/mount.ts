import type { Router } from 'express';
import { outboxRouter } from '../mail/router';
import { tokensRouter } from '../tokens/router';
import { usersRouter } from '../users/router';
import type { AccountDeps } from './deps';
import { identify } from './identity';
import { originCheck } from './origin';
import { authRouter } from './router';
import { sessionMiddleware } from './session';

/**
 * Who is asking, for every API route mounted after this: the Origin check on
 * state-changing requests, the session cookie, and bearer tokens → req.user.
 */
export function mountIdentity(api: Router, deps: AccountDeps): void {
  api.use(originCheck(deps.config));
  api.use(sessionMiddleware(deps));
  api.use(identify(deps));
}

/** The account routes: /auth, /users, /tokens, /outbox. */
export function mountAccountRoutes(api: Router, deps: AccountDeps): void {
  api.use(authRouter(deps));
  api.use(usersRouter(deps));
  api.use(tokensRouter(deps));
  api.use(outboxRouter(deps));
}
