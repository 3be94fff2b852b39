import path from "node:path";
import fs from "node:fs";
import type { Knex } from "knex";

/**
 * One Knex configuration for the CLI, the app and the tests.
 *
 * SQLite is the embedded default (a file under the git-ignored data/ folder). Setting
 * DATABASE_URL to a postgres:// URL selects PostgreSQL with the same migrations.
 */
export type DatabaseClient = "better-sqlite3" | "pg";

export const SQLITE_BUSY_TIMEOUT_MS = 5_000;

export function defaultSqlitePath(): string {
  return process.env.FLUEWARD_DB_FILE ?? path.join(/* turbopackIgnore: true */ process.cwd(), "data", "flueward.sqlite");
}

/** How many distinct SQL texts each SQLite connection keeps prepared. */
export const PREPARED_STATEMENT_CACHE_SIZE = 500;

interface PreparingConnection {
  prepare: (sql: string) => unknown;
}

/**
 * Keeps each SQL text's prepared statement on the connection, so a query the app runs again
 * (the same text with other bindings) skips SQLite's parse and plan step. Knex prepares anew on
 * every call otherwise. better-sqlite3 statements are reusable, re-prepare themselves after a
 * schema change, and knex runs them with all()/run() to completion, never two at once on one
 * connection. Bounded: least recently used texts are dropped past the limit.
 */
export function cachePreparedStatements(connection: PreparingConnection, limit = PREPARED_STATEMENT_CACHE_SIZE): void {
  const prepare = connection.prepare.bind(connection);
  const statements = new Map<string, unknown>();
  connection.prepare = (sql: string) => {
    const cached = statements.get(sql);
    if (cached !== undefined) {
      statements.delete(sql);
      statements.set(sql, cached);
      return cached;
    }
    const statement = prepare(sql);
    statements.set(sql, statement);
    if (statements.size > limit) statements.delete(statements.keys().next().value as string);
    return statement;
  };
}

/** Pragmas applied to every new SQLite connection: durability, integrity and waiting on locks. */
export function applySqlitePragmas(connection: { pragma: (sql: string) => unknown }): void {
  connection.pragma("journal_mode = WAL");
  connection.pragma("synchronous = FULL");
  connection.pragma("foreign_keys = ON");
  connection.pragma(`busy_timeout = ${SQLITE_BUSY_TIMEOUT_MS}`);
}

export function buildKnexConfig(options: { databaseUrl?: string; sqliteFile?: string } = {}): Knex.Config {
  const databaseUrl = options.databaseUrl ?? process.env.DATABASE_URL;
  const common = {
    migrations: { directory: path.join(/* turbopackIgnore: true */ process.cwd(), "db", "migrations"), extension: "ts", tableName: "knex_migrations" },
    seeds: { directory: path.join(/* turbopackIgnore: true */ process.cwd(), "db", "seeds"), extension: "ts", loadExtensions: [".ts"] },
  } satisfies Partial<Knex.Config>;

  if (databaseUrl && /^postgres(ql)?:\/\//.test(databaseUrl)) {
    return { client: "pg", connection: databaseUrl, pool: { min: 0, max: 10 }, ...common };
  }

  const filename = options.sqliteFile ?? defaultSqlitePath();
  if (filename !== ":memory:") fs.mkdirSync(path.dirname(filename), { recursive: true });
  return {
    client: "better-sqlite3",
    connection: { filename },
    useNullAsDefault: true,
    pool: {
      min: 1,
      max: 1,
      afterCreate: (connection: { pragma: (sql: string) => unknown } & PreparingConnection, done: (err: Error | null, conn: unknown) => void) => {
        try {
          applySqlitePragmas(connection);
          cachePreparedStatements(connection);
          done(null, connection);
        } catch (error) {
          done(error as Error, connection);
        }
      },
    },
    ...common,
  };
}
