import type { RequestHandler } from 'express';
import { HttpError } from '../http/errors';

/**
 * For account management (people, tokens, passwords, outbox): an API token
 * is refused here, so a leaked token cannot mint tokens or change accounts.
 */
export const sessionOnly: RequestHandler = (req, _res, next) => {
  if (req.user?.via === 'token') {
    return next(new HttpError(403, 'session-required', 'Sign in with a browser for this; API tokens cannot manage accounts.'));
  }
  next();
};
