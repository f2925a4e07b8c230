import type { RequestHandler } from 'express';
import { rateLimit } from 'express-rate-limit';
import type { Config } from '../config';
import { HttpError } from '../http/errors';

/**
 * Per-client-address limit on the unauthenticated account routes (sign-in,
 * invitation, password reset). One instance per app, so each test app and
 * each server start counts afresh.
 */
export function accountAttemptLimiter(config: Config): RequestHandler {
  return rateLimit({
    windowMs: 15 * 60_000,
    limit: config.signInLimit,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    handler: (_req, _res, next) =>
      next(new HttpError(429, 'too-many-attempts', 'Too many attempts from this address. Wait a few minutes and try again.')),
  });
}
