import argon2 from 'argon2';
import type { Knex } from 'knex';
import { demoUsers } from './data/demo';

/** Seeds one user per role; runs only on an empty users table. */
export async function seed(knex: Knex): Promise<void> {
  const existing = await knex('users').count<{ n: number }[]>({ n: '*' });
  if (Number(existing[0].n) > 0) return;
  for (const u of demoUsers) {
    const hash = await argon2.hash(u.password, { type: argon2.argon2id });
    const [row] = await knex('users')
      .insert({ email: u.email, display_name: u.displayName, password_hash: hash })
      .returning('id');
    const id = typeof row === 'object' ? row.id : row;
    await knex('user_roles').insert(u.roles.map((role) => ({ user_id: id, role })));
  }
}
