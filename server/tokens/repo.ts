import type { Knex } from 'knex';

export interface TokenRow {
  id: number;
  user_id: number;
  name: string;
  token_hash: string;
  hint: string;
  created_at_ms: number;
  last_used_at_ms: number | null;
  revoked_at_ms: number | null;
}

export async function insertToken(db: Knex, row: Omit<TokenRow, 'id'>): Promise<number> {
  const [r] = await db('api_tokens').insert(row).returning('id');
  return typeof r === 'object' ? r.id : r;
}

export async function tokensOf(db: Knex, userId: number): Promise<TokenRow[]> {
  return db('api_tokens').where({ user_id: userId }).orderBy('id', 'desc').select('*');
}

export async function tokenById(db: Knex, id: number): Promise<TokenRow | undefined> {
  return db('api_tokens').where({ id }).first();
}

export async function liveTokenByHash(db: Knex, hash: string): Promise<TokenRow | undefined> {
  return db('api_tokens').where({ token_hash: hash }).whereNull('revoked_at_ms').first();
}

export async function markRevoked(db: Knex, id: number, at: number): Promise<void> {
  await db('api_tokens').where({ id }).whereNull('revoked_at_ms').update({ revoked_at_ms: at });
}

export async function markUsed(db: Knex, id: number, at: number): Promise<void> {
  await db('api_tokens').where({ id }).update({ last_used_at_ms: at });
}
