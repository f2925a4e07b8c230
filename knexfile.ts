import type { Knex } from 'knex';
import path from 'node:path';

/**
 * Knex settings for a SQLite file. The server, the CLIs and the tests all
 * open the database through this one function.
 */
export function knexSettings(file: string): Knex.Config {
  return {
    client: 'better-sqlite3',
    connection: { filename: file },
    useNullAsDefault: true,
    // One writer at a time is SQLite's rule; a single pooled connection keeps
    // transactions from ever waiting on each other inside one process.
    pool: {
      min: 1,
      max: 1,
      afterCreate(conn: any, done: (err: Error | null, conn: unknown) => void) {
        try {
          if (file !== ':memory:') conn.pragma('journal_mode = WAL');
          conn.pragma('busy_timeout = 5000');
          conn.pragma('foreign_keys = ON');
          done(null, conn);
        } catch (err) {
          done(err as Error, conn);
        }
      },
    },
    migrations: {
      directory: path.join(__dirname, 'migrations'),
      loadExtensions: ['.ts'],
      tableName: 'knex_migrations',
    },
    seeds: {
      directory: path.join(__dirname, 'seeds'),
      loadExtensions: ['.ts'],
    },
  };
}

const config: Record<string, Knex.Config> = {
  development: knexSettings(path.resolve(__dirname, process.env.HAIRLINE_DATABASE ?? 'data/hairline.sqlite3')),
};

export default config;
