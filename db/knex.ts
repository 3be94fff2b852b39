import knexFactory, { type Knex } from "knex";
import { buildKnexConfig } from "./config";
import { readOnSeparateConnection } from "./sqlite-reader";

/**
 * The app's one Knex instance. Only lib/data uses it. Cached on globalThis so that `next dev`'s
 * module reloading does not open a new connection pool on every edit.
 */
const globalForKnex = globalThis as unknown as { fluewardKnex?: Knex };

export function getDb(): Knex {
  if (!globalForKnex.fluewardKnex) {
    const config = buildKnexConfig();
    if (config.client === "better-sqlite3") beginSqliteTransactionsImmediately();
    const db = knexFactory(config);
    if (config.client === "better-sqlite3") readOnSeparateConnection(db, (config.connection as Knex.BetterSqlite3ConnectionConfig).filename);
    globalForKnex.fluewardKnex = db;
  }
  return globalForKnex.fluewardKnex;
}

export function isSqlite(db: Knex): boolean {
  return db.client.config.client === "better-sqlite3";
}

/**
 * Every SQLite transaction begins IMMEDIATE: it takes the write lock up front, so two processes
 * doing read-modify-write on one database file wait on busy_timeout instead of failing halfway
 * with SQLITE_BUSY (knex would otherwise send a deferred BEGIN). Applied once per process.
 */
function beginSqliteTransactionsImmediately(): void {
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  const SqliteTransaction = require("knex/lib/dialects/sqlite3/execution/sqlite-transaction") as {
    prototype: { begin: (conn: unknown) => Promise<unknown>; query: (conn: unknown, sql: string) => Promise<unknown> };
  };
  if ((SqliteTransaction.prototype as { fluewardImmediate?: boolean }).fluewardImmediate) return;
  SqliteTransaction.prototype.begin = function begin(this: typeof SqliteTransaction.prototype, conn: unknown) {
    return this.query(conn, "BEGIN IMMEDIATE;");
  };
  (SqliteTransaction.prototype as { fluewardImmediate?: boolean }).fluewardImmediate = true;
}
