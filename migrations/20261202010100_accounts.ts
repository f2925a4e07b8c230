import type { Knex } from 'knex';

/**
 * Accounts: browser sessions, sign-in back-off, single-use e-mail links
 * (invitations and password resets), personal API tokens, the outbox of the
 * local mail fake, and the append-only, hash-chained event trail.
 */
export async function up(knex: Knex): Promise<void> {
  // Read and written by connect-session-knex; `sess` is the session as JSON.
  await knex.schema.createTable('sessions', (t) => {
    t.string('sid', 255).primary();
    t.json('sess').notNullable();
    t.timestamp('expired').notNullable().index();
  });
  // One row per e-mail address (known or not), so unknown addresses back off alike.
  await knex.schema.createTable('sign_in_backoff', (t) => {
    t.string('email', 254).primary();
    t.integer('failures').notNullable().defaultTo(0);
    t.bigInteger('blocked_until_ms').notNullable().defaultTo(0);
  });
  await knex.schema.createTable('account_links', (t) => {
    t.increments('id').primary();
    t.string('purpose', 16).notNullable(); // 'invitation' | 'reset'
    t.integer('user_id').notNullable().references('users.id');
    t.string('token_hash', 64).notNullable().unique();
    t.bigInteger('expires_at_ms').notNullable();
    t.bigInteger('used_at_ms').nullable();
    t.integer('created_by').nullable().references('users.id');
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw(`
    CREATE TRIGGER account_links_known_purpose BEFORE INSERT ON account_links
    WHEN NEW.purpose NOT IN ('invitation', 'reset')
    BEGIN SELECT RAISE(ABORT, 'unknown link purpose'); END;
  `);
  await knex.schema.createTable('api_tokens', (t) => {
    t.increments('id').primary();
    t.integer('user_id').notNullable().references('users.id');
    t.string('name', 80).notNullable();
    t.string('token_hash', 64).notNullable().unique();
    t.string('hint', 16).notNullable(); // the first characters, to tell tokens apart
    t.bigInteger('created_at_ms').notNullable();
    t.bigInteger('last_used_at_ms').nullable();
    t.bigInteger('revoked_at_ms').nullable();
  });
  await knex.schema.createTable('outbox', (t) => {
    t.increments('id').primary();
    t.bigInteger('received_at_ms').notNullable();
    t.string('mail_from', 320).notNullable();
    t.text('rcpt_to').notNullable();
    t.text('subject').notNullable();
    t.text('text_body').notNullable();
    t.text('raw').notNullable();
  });
  await knex.schema.createTable('events', (t) => {
    t.increments('id').primary();
    t.string('at', 32).notNullable(); // ISO 8601, part of the hashed record
    t.integer('actor_id').nullable().references('users.id');
    t.string('action', 64).notNullable();
    t.string('subject_type', 32).notNullable();
    t.string('subject_id', 254).nullable();
    t.text('old_value').nullable();
    t.text('new_value').nullable();
    t.text('reason').nullable();
    t.string('prev_hash', 64).notNullable();
    t.string('hash', 64).notNullable().unique();
  });
  // The trail is append-only: the database refuses edits and deletions.
  await knex.raw(`CREATE TRIGGER events_no_update BEFORE UPDATE ON events BEGIN SELECT RAISE(ABORT, 'events are append-only'); END;`);
  await knex.raw(`CREATE TRIGGER events_no_delete BEFORE DELETE ON events BEGIN SELECT RAISE(ABORT, 'events are append-only'); END;`);
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ['events', 'outbox', 'api_tokens', 'account_links', 'sign_in_backoff', 'sessions']) {
    await knex.schema.dropTableIfExists(table);
  }
}
