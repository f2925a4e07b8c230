import { createHash } from 'node:crypto';
import type { RequestHandler } from 'express';
import helmet from 'helmet';

/** The one inline script of Expo Router's static export (it switches the client to hydration). */
const hydrateScript = 'globalThis.__EXPO_ROUTER_HYDRATE__=true;';
const hydrateHash = `'sha256-${createHash('sha256').update(hydrateScript).digest('base64')}'`;

/**
 * helmet's headers with a content security policy that fits the static
 * export: scripts only from this server plus the hydration line by hash,
 * inline styles (React Native Web writes them), fonts and images from here.
 * No upgrade-insecure-requests: a loopback server runs over plain HTTP.
 */
export function securityHeaders(): RequestHandler {
  return helmet({
    contentSecurityPolicy: {
      useDefaults: true,
      directives: {
        'script-src': ["'self'", hydrateHash],
        'style-src': ["'self'", "'unsafe-inline'"],
        'img-src': ["'self'", 'data:', 'blob:'],
        'font-src': ["'self'", 'data:'],
        'connect-src': ["'self'"],
        'upgrade-insecure-requests': null,
      },
    },
  });
}
