import type { Knex } from 'knex';

/**
 * Audits: one sweep of one network version with fixed settings, its per-edge
 * results, the auditor's dispositions and the approver's seal. Once an audit
 * is sealed the database itself refuses every change to it (the API refuses
 * first; the triggers hold even for someone with a SQL prompt).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('audits', (t) => {
    t.increments('id').primary();
    t.integer('network_version_id').notNullable().references('network_versions.id');
    t.string('state', 20).notNullable().defaultTo('queued');
    t.text('settings_json').notNullable();
    t.integer('started_by').notNullable().references('users.id');
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.string('finished_at', 32).nullable();
    t.integer('progress_done').notNullable().defaultTo(0);
    t.integer('progress_total').notNullable().defaultTo(0);
    // Pace of the current run segment, for the time-left estimate after a resume.
    t.bigInteger('segment_started_ms').nullable();
    t.integer('segment_done_at_start').notNullable().defaultTo(0);
    t.text('reason').nullable();
    t.text('baseline_json').nullable(); // λ2, cluster, spectrum, rooted, cut-off nodes
    t.float('lambda2_re').nullable();
    t.float('lambda2_im').nullable();
    t.integer('lock_by').nullable().references('users.id');
    t.string('lock_at', 32).nullable();
    t.text('lock_comment').nullable();
    t.string('lock_hash', 64).nullable();
    t.index(['state']);
  });
  await knex.schema.createTable('audit_edges', (t) => {
    t.integer('audit_id').notNullable().references('audits.id').onDelete('CASCADE');
    t.integer('edge_index').notNullable();
    t.string('source', 255).notNullable();
    t.string('target', 255).notNullable();
    t.float('weight').notNullable();
    t.string('class', 12).notNullable();
    t.integer('class_rank').notNullable(); // severity order for sorting
    t.string('plus_class', 12).nullable();
    t.float('plus_exponent').nullable();
    t.string('minus_class', 12).nullable();
    t.float('minus_exponent').nullable();
    t.string('flags', 200).notNullable().defaultTo('');
    t.float('tolerance').notNullable();
    t.float('tolerance_rel').nullable();
    t.float('sensitivity').nullable();
    t.boolean('flagged').notNullable();
    t.text('detail_json').notNullable(); // ladder points, fits, budget: the plot's data
    t.primary(['audit_id', 'edge_index']);
    t.index(['audit_id', 'class']);
    t.index(['audit_id', 'flagged']);
    t.index(['audit_id', 'tolerance_rel']);
    t.index(['audit_id', 'plus_exponent']);
    t.index(['audit_id', 'minus_exponent']);
  });
  await knex.schema.createTable('audit_dispositions', (t) => {
    t.integer('audit_id').notNullable().references('audits.id').onDelete('CASCADE');
    t.integer('edge_index').notNullable();
    t.string('kind', 10).notNullable(); // accept | mitigate | monitor
    t.text('note').notNullable();
    t.integer('by_user').notNullable().references('users.id');
    t.string('at', 32).notNullable();
    t.primary(['audit_id', 'edge_index']);
  });
  const sealed = (ref: string) => `(SELECT state FROM audits WHERE id = ${ref}) = 'sealed'`;
  const refuse = `SELECT RAISE(ABORT, 'audit is sealed: no changes allowed');`;
  await knex.raw(`CREATE TRIGGER audits_sealed_no_update BEFORE UPDATE ON audits WHEN OLD.state = 'sealed' BEGIN ${refuse} END;`);
  await knex.raw(`CREATE TRIGGER audits_sealed_no_delete BEFORE DELETE ON audits WHEN OLD.state = 'sealed' BEGIN ${refuse} END;`);
  for (const table of ['audit_edges', 'audit_dispositions']) {
    await knex.raw(`CREATE TRIGGER ${table}_sealed_no_insert BEFORE INSERT ON ${table} WHEN ${sealed('NEW.audit_id')} BEGIN ${refuse} END;`);
    await knex.raw(`CREATE TRIGGER ${table}_sealed_no_update BEFORE UPDATE ON ${table} WHEN ${sealed('OLD.audit_id')} BEGIN ${refuse} END;`);
    await knex.raw(`CREATE TRIGGER ${table}_sealed_no_delete BEFORE DELETE ON ${table} WHEN ${sealed('OLD.audit_id')} BEGIN ${refuse} END;`);
  }
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('audit_dispositions');
  await knex.schema.dropTable('audit_edges');
  await knex.schema.dropTable('audits');
}
