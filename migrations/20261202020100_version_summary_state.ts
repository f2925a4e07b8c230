import type { Knex } from 'knex';

/**
 * The spectrum of a large network takes minutes, so a version is stored at
 * once and its summary follows from a background worker.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('network_versions', (t) => {
    t.string('summary_state', 8).notNullable().defaultTo('pending'); // pending | ready | failed
    t.text('summary_error').nullable();
    t.float('lambda2_re').nullable(); // copied out of the summary for sorting
  });
  await knex.schema.alterTable('networks', (t) => {
    t.timestamp('updated_at').nullable();
  });
  await knex('networks').update({ updated_at: knex.ref('created_at') });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('network_versions', (t) => {
    t.dropColumn('summary_state');
    t.dropColumn('summary_error');
    t.dropColumn('lambda2_re');
  });
  await knex.schema.alterTable('networks', (t) => t.dropColumn('updated_at'));
}
