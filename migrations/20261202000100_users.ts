import type { Knex } from 'knex';

/** People and the roles they hold; a user may hold several roles. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('users', (t) => {
    t.increments('id').primary();
    t.string('email', 254).notNullable().unique();
    t.string('display_name', 120).notNullable();
    t.string('password_hash', 255).nullable(); // null until an invitation is accepted
    t.boolean('active').notNullable().defaultTo(true);
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at').notNullable().defaultTo(knex.fn.now());
  });
  await knex.schema.createTable('user_roles', (t) => {
    t.integer('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.string('role', 16).notNullable();
    t.primary(['user_id', 'role']);
  });
  await knex.raw(`
    CREATE TRIGGER user_roles_known_role BEFORE INSERT ON user_roles
    WHEN NEW.role NOT IN ('admin', 'analyst', 'auditor', 'approver')
    BEGIN SELECT RAISE(ABORT, 'unknown role'); END;
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('user_roles');
  await knex.schema.dropTable('users');
}
