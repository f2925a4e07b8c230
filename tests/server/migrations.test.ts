import argon2 from 'argon2';
import type { Knex } from 'knex';
import { demoNetworks, demoUsers } from '../../seeds/data/demo';
import { expectRefusal, freshDatabase } from './support/test-db';

describe('migrations and demo seeds', () => {
  let db: Knex;
  beforeAll(async () => {
    db = await freshDatabase({ seed: true });
  });
  afterAll(() => db.destroy());

  test('one demo user per role, each password stored as an argon2id hash that verifies', async () => {
    const rows = await db('users').join('user_roles', 'users.id', 'user_roles.user_id').select('email', 'role', 'password_hash');
    expect(rows.map((r) => r.role).sort()).toEqual(['admin', 'analyst', 'approver', 'auditor']);
    for (const u of demoUsers) {
      const row = rows.find((r) => r.email === u.email)!;
      expect(row.password_hash).toMatch(/^\$argon2id\$/);
      expect(await argon2.verify(row.password_hash, u.password)).toBe(true);
    }
  });

  test('seeding twice adds nothing', async () => {
    await db.seed.run();
    expect(Number((await db('users').count({ n: '*' }))[0].n)).toBe(demoUsers.length);
    expect(Number((await db('networks').count({ n: '*' }))[0].n)).toBe(demoNetworks.length);
  });

  test('demo networks are stored as version 1 with their edge lists', async () => {
    const versions = await db('network_versions').select('*');
    expect(versions).toHaveLength(3);
    for (const v of versions) {
      const list = JSON.parse(v.edges_json);
      expect(list.edges).toHaveLength(v.edge_count);
      expect(list.nodes).toHaveLength(v.node_count);
      expect(v.version).toBe(1);
    }
  });

  test('a stored network version cannot be edited (database trigger)', async () => {
    const v = await db('network_versions').first('id');
    await expectRefusal(db('network_versions').where({ id: v.id }).update({ edges_json: '{}' }), /immutable/);
  });

  test('an unknown role is refused by the database', async () => {
    const u = await db('users').first('id');
    await expectRefusal(db('user_roles').insert({ user_id: u.id, role: 'overlord' }), /unknown role/);
  });

  test('the database runs with foreign keys enforced', async () => {
    await expectRefusal(db('user_roles').insert({ user_id: 99999, role: 'admin' }), /FOREIGN KEY/);
  });
});
