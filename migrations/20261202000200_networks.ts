import type { Knex } from 'knex';

/**
 * Networks and their immutable versions. A version holds the whole validated
 * edge list (as JSON) and the summary computed once at import.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('networks', (t) => {
    t.increments('id').primary();
    t.string('name', 160).notNullable().unique();
    t.text('description').notNullable().defaultTo('');
    t.string('convention', 3).notNullable().defaultTo('in'); // 'in' | 'out'
    t.integer('created_by').nullable().references('users.id');
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
  });
  await knex.schema.createTable('network_versions', (t) => {
    t.increments('id').primary();
    t.integer('network_id').notNullable().references('networks.id').onDelete('CASCADE');
    t.integer('version').notNullable();
    t.integer('node_count').notNullable();
    t.integer('edge_count').notNullable();
    t.text('edges_json').notNullable();
    t.text('summary_json').nullable();
    t.string('source_name', 255).notNullable().defaultTo('');
    t.integer('created_by').nullable().references('users.id');
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.unique(['network_id', 'version']);
  });
  // A stored version is a record others sign against: it never changes.
  await knex.raw(`
    CREATE TRIGGER network_versions_immutable BEFORE UPDATE OF edges_json, node_count, edge_count, version, network_id ON network_versions
    BEGIN SELECT RAISE(ABORT, 'network versions are immutable'); END;
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('network_versions');
  await knex.schema.dropTable('networks');
}
