import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import knexFactory, { type Knex } from "knex";
import { afterEach, describe, expect, test } from "vitest";
import { buildKnexConfig } from "@/db/config";
import { readOnSeparateConnection } from "@/db/sqlite-reader";

/**
 * Plain reads run on their own read-only connection (db/sqlite-reader.ts). What must hold: a read
 * outside a transaction sees every committed write and never waits for an open write transaction
 * (SQLite docs, "Write-Ahead Logging": readers and the writer do not block each other); a read
 * inside a transaction sees that transaction's own writes; writes still go through the pool.
 */
describe("reads outside a transaction use a separate read-only connection", () => {
  let db: Knex | null = null;
  let dir = "";
  afterEach(async () => {
    await db?.destroy();
    db = null;
    fs.rmSync(dir, { recursive: true, force: true });
  });

  async function open(): Promise<Knex> {
    dir = fs.mkdtempSync(path.join(os.tmpdir(), "flueward-reader-"));
    const file = path.join(dir, "reader.sqlite");
    db = knexFactory(buildKnexConfig({ sqliteFile: file }));
    readOnSeparateConnection(db, file);
    await db.schema.createTable("notes", (t) => {
      t.increments("id");
      t.string("body").notNullable();
    });
    await db("notes").insert({ body: "first" });
    return db;
  }

  const count = async (q: Knex | Knex.Transaction) => Number((await q("notes").count<{ n: number }[]>({ n: "*" }).first())?.n);

  test("a read while a write transaction is open answers at once with the last committed state", async () => {
    const knex = await open();
    let release!: () => void;
    const held = new Promise<void>((resolve) => (release = resolve));
    let insideSawOwnWrite = Number.NaN;
    const transaction = knex.transaction(async (trx) => {
      await trx("notes").insert({ body: "second, not yet committed" });
      insideSawOwnWrite = await count(trx);
      await held;
    });
    // Let the transaction take the connection and insert before reading beside it.
    await new Promise((resolve) => setTimeout(resolve, 50));
    const outsideDuring = await Promise.race([count(knex), new Promise<string>((resolve) => setTimeout(() => resolve("waited"), 1_000))]);
    expect(outsideDuring).toBe(1); // with one pooled connection this read would wait for the commit
    expect(insideSawOwnWrite).toBe(2);
    release();
    await transaction;
    expect(await count(knex)).toBe(2); // committed, and visible to the next read at once
  });

  test("first(), pluck() and joins read the same rows as before; writes and raw SQL still work", async () => {
    const knex = await open();
    await knex("notes").insert([{ body: "b" }, { body: "c" }]);
    expect(await knex("notes").where({ id: 1 }).first("body")).toEqual({ body: "first" });
    expect(await knex("notes").orderBy("id").pluck("body")).toEqual(["first", "b", "c"]);
    expect(await knex("notes as a").join("notes as b", "b.id", "a.id").where("a.id", 2).select("b.body")).toEqual([{ body: "b" }]);
    await knex("notes").where({ id: 3 }).update({ body: "c2" });
    await knex("notes").where({ id: 2 }).delete();
    expect(await knex("notes").orderBy("id").pluck("body")).toEqual(["first", "c2"]);
    expect(await knex.raw("select count(*) as n from notes")).toEqual([{ n: 2 }]);
  });

  test("a schema change by the writer is seen by the reader's cached statements", async () => {
    const knex = await open();
    expect(await knex("notes").select("*")).toEqual([{ id: 1, body: "first" }]);
    await knex.schema.alterTable("notes", (t) => t.string("tag").notNullable().defaultTo("none"));
    expect(await knex("notes").select("*")).toEqual([{ id: 1, body: "first", tag: "none" }]);
  });

  test("before the file exists a read goes through the pool, which creates it", async () => {
    dir = fs.mkdtempSync(path.join(os.tmpdir(), "flueward-reader-"));
    const file = path.join(dir, "later.sqlite");
    db = knexFactory(buildKnexConfig({ sqliteFile: file }));
    readOnSeparateConnection(db, file);
    expect(await db.select(db.raw("1 as one")).first()).toEqual({ one: 1 });
    expect(fs.existsSync(file)).toBe(true);
  });
});
