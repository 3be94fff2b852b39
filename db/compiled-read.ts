import type { Knex } from "knex";
import type Database from "better-sqlite3";
import { readOnlyConnectionOf } from "./sqlite-reader";

export type ReadParams = Record<string, number | string>;
export type Row = Record<string, unknown>;

interface Compiled {
  sql: string;
  /** For each `?` of the SQL: the parameter whose value goes there, or a constant Knex bound. */
  slots: ({ param: string } | { constant: unknown })[];
}

/** Values no real parameter takes, to find where Knex put each parameter among its bindings. */
function markerFor(name: string, index: number, value: number | string): number | string {
  return typeof value === "number" ? -7_301_900_000_000 - index : `\u0001compiled-read:${name}\u0001`;
}

/** A constant as Knex's better-sqlite3 client binds it (dates as milliseconds, booleans as 0/1). */
function sqliteValue(value: unknown): unknown {
  if (value instanceof Date) return value.valueOf();
  if (typeof value === "boolean") return Number(value);
  return value;
}

function compile<P extends ReadParams>(db: Knex, params: P, build: (db: Knex, params: P) => Knex.QueryBuilder): Compiled {
  const names = Object.keys(params);
  const markers = Object.fromEntries(names.map((name, index) => [name, markerFor(name, index, params[name]!)])) as P;
  const byMarker = new Map<unknown, string>(names.map((name) => [markers[name], name]));
  const native = build(db, markers).toSQL().toNative();
  const slots = native.bindings.map((value) => (byMarker.has(value) ? { param: byMarker.get(value)! } : { constant: sqliteValue(value) }));
  for (const name of names) {
    if (!slots.some((slot) => "param" in slot && slot.param === name)) throw new Error(`compiledRead: parameter ${name} is not bound in the query`);
    if (native.sql.includes(String(markers[name]))) throw new Error(`compiledRead: parameter ${name} is written into the SQL text instead of bound`);
  }
  return { sql: native.sql, slots };
}

/**
 * A hot read whose SQL never changes, only its values (one inspection by id, its comments).
 * Knex builds and compiles the query once, with marker values standing for the parameters;
 * each later call binds the new values to that statement on the read-only SQLite connection
 * (db/sqlite-reader.ts) and runs it synchronously, skipping Knex's per-call building, compiling
 * and promise chain — in-process, one inspection read went from about 0.53 to 0.33 ms (README, Performance).
 * Anywhere else (PostgreSQL, a transaction, an in-memory database) the query is built and run by
 * Knex as usual: the same SQL and the same rows.
 *
 * `build` must use only the parameters it is given for values that change (a value captured
 * from outside would be frozen into the first compile); the compile checks that every parameter
 * reaches a binding.
 */
export function compiledRead<P extends ReadParams>(method: "first", build: (db: Knex, params: P) => Knex.QueryBuilder): (db: Knex, params: P) => Promise<Row | undefined>;
export function compiledRead<P extends ReadParams>(method: "all", build: (db: Knex, params: P) => Knex.QueryBuilder): (db: Knex, params: P) => Promise<Row[]>;
export function compiledRead<P extends ReadParams>(method: "first" | "all", build: (db: Knex, params: P) => Knex.QueryBuilder) {
  const compiledFor = new WeakMap<Knex, Compiled>();
  const statements = new WeakMap<Database.Database, Database.Statement>();
  return async (db: Knex, params: P): Promise<Row | Row[] | undefined> => {
    const reader = readOnlyConnectionOf(db);
    if (!reader) return (await build(db, params)) as Row | Row[] | undefined;
    let compiled = compiledFor.get(db);
    if (!compiled) {
      compiled = compile(db, params, build);
      compiledFor.set(db, compiled);
    }
    let statement = statements.get(reader);
    if (!statement) {
      statement = reader.prepare(compiled.sql);
      statements.set(reader, statement);
    }
    const values = compiled.slots.map((slot) => ("param" in slot ? params[slot.param] : slot.constant));
    // Knex's own "query" event, so whoever watches the queries (bench/db-queries.bench.ts) sees these too.
    if (db.listenerCount("query") > 0) db.emit("query", { method: method === "first" ? "first" : "select", sql: compiled.sql, bindings: values, fromCompiledRead: true });
    return method === "first" ? (statement.get(...values) as Row | undefined) : (statement.all(...values) as Row[]);
  };
}
