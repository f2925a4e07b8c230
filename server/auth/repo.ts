import type { Knex } from 'knex';
import type { Role } from '../../lib/schemas/roles';

export interface UserRow {
  id: number;
  email: string;
  display_name: string;
  password_hash: string | null;
  active: number | boolean;
}

export async function findUserByEmail(db: Knex, email: string): Promise<UserRow | undefined> {
  return db('users').where({ email }).first();
}

export async function findUserById(db: Knex, id: number): Promise<UserRow | undefined> {
  return db('users').where({ id }).first();
}

export async function rolesOf(db: Knex, userId: number): Promise<Role[]> {
  const rows = await db('user_roles').where({ user_id: userId }).orderBy('role').select('role');
  return rows.map((r) => r.role as Role);
}

export async function setPasswordHash(db: Knex, userId: number, hash: string): Promise<void> {
  await db('users').where({ id: userId }).update({ password_hash: hash, updated_at: db.fn.now() });
}

export async function backoffOf(db: Knex, email: string): Promise<{ failures: number; blockedUntil: number }> {
  const row = await db('sign_in_backoff').where({ email }).first();
  return { failures: row ? Number(row.failures) : 0, blockedUntil: row ? Number(row.blocked_until_ms) : 0 };
}

export async function saveBackoff(db: Knex, email: string, failures: number, blockedUntil: number): Promise<void> {
  await db('sign_in_backoff')
    .insert({ email, failures, blocked_until_ms: blockedUntil })
    .onConflict('email')
    .merge();
}

export async function clearBackoff(db: Knex, email: string): Promise<void> {
  await db('sign_in_backoff').where({ email }).del();
}

/** Ends every stored session of a user (deactivation, password change). */
export async function deleteSessionsOf(db: Knex, userId: number, exceptSid?: string): Promise<void> {
  const q = db('sessions').whereRaw("json_extract(sess, '$.userId') = ?", [userId]);
  if (exceptSid) q.whereNot({ sid: exceptSid });
  await q.del();
}
