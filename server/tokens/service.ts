import type { ApiToken } from '../../lib/schemas/tokens';
import type { AccountDeps } from '../auth/deps';
import { findUserById, rolesOf } from '../auth/repo';
import type { RequestUser } from '../auth/require-roles';
import { hashSecret, newSecret } from '../auth/secrets';
import { HttpError } from '../http/errors';
import { recordEvent } from '../trail/service';
import { insertToken, liveTokenByHash, markRevoked, markUsed, tokenById, tokensOf, type TokenRow } from './repo';

/** Every token starts with this, so a leaked one is easy to recognise in logs and scanners. */
export const tokenPrefix = 'hl_';

const iso = (ms: number | null) => (ms === null ? null : new Date(Number(ms)).toISOString());

function toApiToken(r: TokenRow): ApiToken {
  return {
    id: r.id,
    name: r.name,
    hint: r.hint,
    createdAt: iso(r.created_at_ms)!,
    lastUsedAt: iso(r.last_used_at_ms),
    revokedAt: iso(r.revoked_at_ms),
  };
}

export async function listTokens(deps: AccountDeps, userId: number): Promise<ApiToken[]> {
  return (await tokensOf(deps.db, userId)).map(toApiToken);
}

/** Creates a token; the secret is returned this once and stored only as a hash. */
export async function createToken(deps: AccountDeps, userId: number, name: string): Promise<{ token: ApiToken; secret: string }> {
  const secret = tokenPrefix + newSecret();
  const now = deps.now();
  const id = await deps.db.transaction(async (trx) => {
    const newId = await insertToken(trx, {
      user_id: userId,
      name,
      token_hash: hashSecret(secret),
      hint: secret.slice(0, 9),
      created_at_ms: now,
      last_used_at_ms: null,
      revoked_at_ms: null,
    });
    await recordEvent(trx, { actorId: userId, action: 'token.created', subjectType: 'api-token', subjectId: newId, newValue: name }, now);
    return newId;
  });
  return { token: toApiToken((await tokenById(deps.db, id))!), secret };
}

/** Revokes one of the caller's own tokens; another person's token is a 404, not a 403. */
export async function revokeToken(deps: AccountDeps, userId: number, tokenId: number): Promise<void> {
  const row = await tokenById(deps.db, tokenId);
  if (!row || row.user_id !== userId) throw new HttpError(404, 'not-found', 'You have no token with that id.');
  if (row.revoked_at_ms !== null) return;
  const now = deps.now();
  await deps.db.transaction(async (trx) => {
    await markRevoked(trx, tokenId, now);
    await recordEvent(trx, { actorId: userId, action: 'token.revoked', subjectType: 'api-token', subjectId: tokenId, oldValue: row.name }, now);
  });
}

/** The person a bearer token speaks for, or null when it is unknown, revoked or its owner is deactivated. */
export async function userForToken(deps: AccountDeps, secret: string): Promise<RequestUser | null> {
  if (!secret.startsWith(tokenPrefix) || secret.length > 100) return null;
  const row = await liveTokenByHash(deps.db, hashSecret(secret));
  if (!row) return null;
  const user = await findUserById(deps.db, row.user_id);
  if (!user || !user.active) return null;
  await markUsed(deps.db, row.id, deps.now());
  return { id: user.id, email: user.email, displayName: user.display_name, roles: await rolesOf(deps.db, user.id), via: 'token' };
}
