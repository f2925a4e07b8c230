import type { RequestHandler } from 'express';
import type { Config } from '../config';
import { HttpError } from '../http/errors';

const safeMethods = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Refuses state-changing requests that a browser sent from another site.
 * A request carrying a bearer token is exempt (no cookie rides along, so no
 * forgery is possible); every other POST/PUT/PATCH/DELETE must name this
 * server in Origin (or, lacking it, Referer).
 */
export function originCheck(config: Config): RequestHandler {
  const configured = config.publicUrl ? new URL(config.publicUrl).origin : null;
  return (req, _res, next) => {
    if (safeMethods.has(req.method)) return next();
    if (/^Bearer\s+\S+$/i.test(req.get('authorization') ?? '')) return next();
    const served = `${req.protocol}://${req.get('host')}`;
    const claimed = req.get('origin') ?? originOf(req.get('referer'));
    if (claimed && (claimed === served || claimed === configured)) return next();
    next(
      new HttpError(
        403,
        'bad-origin',
        claimed
          ? 'This request came from another site and was refused.'
          : 'This request did not say which site sent it (no Origin header) and was refused.',
      ),
    );
  };
}

function originOf(url: string | undefined): string | null {
  if (!url) return null;
  try {
    return new URL(url).origin;
  } catch {
    return null;
  }
}
