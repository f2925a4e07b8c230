import type { Knex } from 'knex';
import { HttpError } from '../http/errors';
import { hashSecret, newSecret } from './secrets';

export type LinkPurpose = 'invitation' | 'reset';

export const linkLifetimeMs: Record<LinkPurpose, number> = {
  invitation: 72 * 3_600_000,
  reset: 60 * 60_000,
};

/** Creates a single-use link token; only its hash is stored. Returns the secret for the e-mail. */
export async function createLink(
  db: Knex,
  purpose: LinkPurpose,
  userId: number,
  createdBy: number | null,
  now: number,
): Promise<string> {
  const secret = newSecret();
  // A new link replaces any unused one of the same purpose.
  await db('account_links').where({ user_id: userId, purpose }).whereNull('used_at_ms').update({ used_at_ms: now });
  await db('account_links').insert({
    purpose,
    user_id: userId,
    token_hash: hashSecret(secret),
    expires_at_ms: now + linkLifetimeMs[purpose],
    created_by: createdBy,
  });
  return secret;
}

/**
 * Spends a link token: it must exist for this purpose, be unused and
 * unexpired. Marking it used is conditional on it still being unused, so two
 * racing requests cannot both spend it. Returns the user id.
 */
export async function spendLink(db: Knex, purpose: LinkPurpose, secret: string, now: number): Promise<number> {
  const row = await db('account_links').where({ token_hash: hashSecret(secret), purpose }).first();
  if (!row) throw new HttpError(404, 'link-unknown', 'This link is not valid. Ask for a new one.');
  if (row.used_at_ms !== null) throw new HttpError(409, 'link-used', 'This link has already been used. Ask for a new one.');
  if (Number(row.expires_at_ms) <= now) throw new HttpError(409, 'link-expired', 'This link has expired. Ask for a new one.');
  const changed = await db('account_links').where({ id: row.id }).whereNull('used_at_ms').update({ used_at_ms: now });
  if (changed !== 1) throw new HttpError(409, 'link-used', 'This link has already been used. Ask for a new one.');
  return Number(row.user_id);
}
