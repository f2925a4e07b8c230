import { ConnectSessionKnexStore } from 'connect-session-knex';
import session from 'express-session';
import type { RequestHandler } from 'express';
import type { AccountDeps } from './deps';

declare module 'express-session' {
  interface SessionData {
    userId: number;
    signedInAt: number;
    lastSeenAt: number;
  }
}

export const sessionCookieName = 'hairline.sid';

/**
 * Browser sessions kept in the `sessions` table of the same SQLite database.
 * The cookie is httpOnly and SameSite=Lax, Secure whenever the request came
 * over TLS (directly or through a loopback proxy), and rolls forward with
 * each request up to the idle timeout. The absolute timeout is checked by
 * `identify`. No cookie is set until someone signs in.
 */
export function sessionMiddleware({ db, config }: AccountDeps): RequestHandler {
  const store = new ConnectSessionKnexStore({ knex: db, tableName: 'sessions', createTable: false, cleanupInterval: 0 });
  // The store checks for its table at once; a database that is down surfaces on use, not as an unhandled rejection.
  store.ready.catch(() => undefined);
  return session({
    name: sessionCookieName,
    secret: config.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    unset: 'destroy',
    cookie: { httpOnly: true, sameSite: 'lax', secure: 'auto', maxAge: config.session.idleMs, path: '/' },
  });
}
