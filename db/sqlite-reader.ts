import fs from "node:fs";
import Database from "better-sqlite3";
import type { Knex } from "knex";
import { SQLITE_BUSY_TIMEOUT_MS, cachePreparedStatements } from "./config";

/** The query-builder methods that only read; everything else (writes, schema, raw SQL) keeps the pool. */
const READ_METHODS = new Set(["select", "first", "pluck"]);

interface RunnerLike {
  connection: unknown;
}
interface ClientLike {
  transacting?: boolean;
  runner(builder: { _method?: string; _connection?: unknown }): RunnerLike;
  destroy(callback?: unknown): Promise<void>;
}

/**
 * Runs the app's plain reads — select, first and pluck builders outside a transaction — on a
 * second, read-only connection to the same SQLite file, handed to Knex's runner the way
 * `.connection()` hands one over, so they skip the pool.
 *
 * Why: the pool holds one connection (SQLite has one writer), so every query of every request
 * queued on it, and a read waited behind a write transaction that was between statements. In
 * WAL mode a reader sees every committed transaction and never waits for the writer (SQLite
 * docs, "Write-Ahead Logging": readers do not block writers and a writer does not block
 * readers), and better-sqlite3 runs a statement to completion synchronously, so two reads never
 * overlap on this connection. Queries inside a transaction run on the transaction's own
 * connection as before (Knex builds a transaction's client from the prototype, not from this
 * instance), so a transaction still reads its own writes.
 *
 * The connection is opened on the first read once the file exists (a migration creates it) and
 * is read-only: a builder wrongly taken for a read fails with SQLITE_READONLY instead of writing
 * outside the write lock. `destroy()` closes it with the pool.
 */
const readers = new WeakMap<Knex, () => Database.Database | null>();

/**
 * The read-only connection of a Knex instance set up by `readOnSeparateConnection`, opened if
 * need be; null for any other instance (PostgreSQL, `:memory:`, a transaction) or before the
 * database file exists. For reads that bind values to a statement of their own
 * (db/compiled-read.ts); everything else goes through Knex.
 */
export function readOnlyConnectionOf(db: Knex | Knex.Transaction): Database.Database | null {
  return readers.get(db as Knex)?.() ?? null;
}

export function readOnSeparateConnection(db: Knex, filename: string): void {
  if (filename === ":memory:") return; // a second connection to :memory: is another database
  const client = db.client as unknown as ClientLike;
  let reader: Database.Database | null = null;

  const openReader = (): Database.Database | null => {
    if (reader?.open) return reader;
    if (!fs.existsSync(filename)) return null;
    const connection = new Database(filename, { readonly: true, fileMustExist: true });
    connection.pragma(`busy_timeout = ${SQLITE_BUSY_TIMEOUT_MS}`);
    cachePreparedStatements(connection);
    reader = connection;
    return reader;
  };

  readers.set(db, openReader);

  const runner = client.runner.bind(client);
  client.runner = (builder) => {
    const run = runner(builder);
    if (!client.transacting && builder._connection === undefined && READ_METHODS.has(builder._method ?? "")) {
      const connection = openReader();
      if (connection) run.connection = connection;
    }
    return run;
  };

  const destroy = client.destroy.bind(client);
  client.destroy = async (callback?: unknown) => {
    reader?.close();
    reader = null;
    return destroy(callback);
  };
}
