import type { Request } from 'express';
import type { Knex } from 'knex';
import type { Config } from '../config';
import type { Mailer } from '../mail/mailer';

/** What the account routers and services need; `now` is injectable so tests can move time. */
export interface AccountDeps {
  db: Knex;
  config: Config;
  mailer: Mailer;
  now: () => number;
}

/** The address links in e-mails point at: HAIRLINE_PUBLIC_URL, else the URL this request came in on. */
export function publicBase(config: Config, req: Request): string {
  if (config.publicUrl) return config.publicUrl.replace(/\/+$/, '');
  return `${req.protocol}://${req.get('host')}`;
}
