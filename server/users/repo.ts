import type { Knex } from 'knex';
import type { Role } from '../../lib/schemas/roles';

export interface UserListRow {
  id: number;
  email: string;
  display_name: string;
  active: number | boolean;
  has_password: number;
  roles: string | null;
}

export async function listUsers(db: Knex): Promise<UserListRow[]> {
  return db('users')
    .leftJoin('user_roles', 'users.id', 'user_roles.user_id')
    .groupBy('users.id')
    .orderBy('users.email')
    .select(
      'users.id',
      'users.email',
      'users.display_name',
      'users.active',
      db.raw('users.password_hash IS NOT NULL AS has_password'),
      db.raw("group_concat(user_roles.role, ',') AS roles"),
    );
}

export async function insertUser(db: Knex, email: string, displayName: string): Promise<number> {
  const [r] = await db('users').insert({ email, display_name: displayName, password_hash: null }).returning('id');
  return typeof r === 'object' ? r.id : r;
}

export async function replaceRoles(db: Knex, userId: number, roles: Role[]): Promise<void> {
  await db('user_roles').where({ user_id: userId }).del();
  await db('user_roles').insert(roles.map((role) => ({ user_id: userId, role })));
}

export async function setActive(db: Knex, userId: number, active: boolean): Promise<void> {
  await db('users').where({ id: userId }).update({ active, updated_at: db.fn.now() });
}

/** Undoes an invitation whose e-mail could not be sent (no event was written yet). */
export async function removeUnsentInvitation(db: Knex, userId: number): Promise<void> {
  await db.transaction(async (trx) => {
    await trx('account_links').where({ user_id: userId }).del();
    await trx('user_roles').where({ user_id: userId }).del();
    await trx('users').where({ id: userId }).whereNull('password_hash').del();
  });
}
