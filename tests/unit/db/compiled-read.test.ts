import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import fc from "fast-check";
import knexFactory, { type Knex } from "knex";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { buildKnexConfig } from "@/db/config";
import { compiledRead } from "@/db/compiled-read";
import { readOnSeparateConnection, readOnlyConnectionOf } from "@/db/sqlite-reader";

/**
 * A compiled read (db/compiled-read.ts) must answer exactly what the same Knex query answers,
 * for any values, on the read-only connection; and fall back to Knex where there is none.
 */
let dir = "";
let db: Knex;

const notesOf = compiledRead("all", (knex, p: { ownerId: number; minScore: number; tag: string }) =>
  knex("notes").where({ owner_id: p.ownerId, tag: p.tag }).andWhere("score", ">=", p.minScore).orderBy("id", "asc").select("id", "body", "score"),
);
const noteById = compiledRead("first", (knex, p: { ownerId: number; id: number }) =>
  knex("notes as n").join("owners as o", "o.id", "n.owner_id").where("n.owner_id", p.ownerId).andWhere("n.id", p.id).first("n.id", "n.body", "o.name as owner_name"),
);

beforeAll(async () => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), "flueward-compiled-"));
  const file = path.join(dir, "compiled.sqlite");
  db = knexFactory(buildKnexConfig({ sqliteFile: file }));
  readOnSeparateConnection(db, file);
  await db.schema.createTable("owners", (t) => {
    t.increments("id");
    t.string("name").notNullable();
  });
  await db.schema.createTable("notes", (t) => {
    t.increments("id");
    t.integer("owner_id").notNullable();
    t.string("tag").notNullable();
    t.integer("score").notNullable();
    t.string("body").notNullable();
  });
  await db("owners").insert([1, 2, 3].map((n) => ({ name: `Owner ${n}` })));
  const rows = [];
  for (let n = 0; n < 120; n++) rows.push({ owner_id: 1 + (n % 3), tag: ["flue", "draft", "hood"][n % 4 % 3]!, score: (n * 37) % 50, body: `note ${n}` });
  await db.batchInsert("notes", rows, 40);
});

afterAll(async () => {
  await db.destroy();
  fs.rmSync(dir, { recursive: true, force: true });
});

describe("compiled reads", () => {
  test("run on the read-only connection", async () => {
    expect(readOnlyConnectionOf(db)).not.toBeNull();
    expect(readOnlyConnectionOf(db)!.readonly).toBe(true);
  });

  test("answer what Knex answers, for any values (property)", async () => {
    await fc.assert(
      fc.asyncProperty(fc.integer({ min: 0, max: 4 }), fc.integer({ min: -5, max: 55 }), fc.constantFrom("flue", "draft", "hood", "none", "flue' or 1=1 --"), fc.integer({ min: 0, max: 130 }), async (ownerId, minScore, tag, id) => {
        const viaKnex = await db("notes").where({ owner_id: ownerId, tag }).andWhere("score", ">=", minScore).orderBy("id", "asc").select("id", "body", "score");
        expect(await notesOf(db, { ownerId, minScore, tag })).toEqual(viaKnex);
        const oneViaKnex = await db("notes as n").join("owners as o", "o.id", "n.owner_id").where("n.owner_id", ownerId).andWhere("n.id", id).first("n.id", "n.body", "o.name as owner_name");
        expect(await noteById(db, { ownerId, id })).toEqual(oneViaKnex);
      }),
      { numRuns: 150 },
    );
    // Something is found, so the equality above is not only between empty answers.
    expect((await notesOf(db, { ownerId: 1, minScore: 0, tag: "flue" })).length).toBeGreaterThan(5);
    expect(await noteById(db, { ownerId: 2, id: 2 })).toEqual({ id: 2, body: "note 1", owner_name: "Owner 2" });
    expect(await noteById(db, { ownerId: 1, id: 2 })).toBeUndefined();
  });

  test("tell Knex's query listeners what they run", async () => {
    const seen: { sql: string; bindings: unknown[] }[] = [];
    const listener = (q: { sql: string; bindings: unknown[] }) => seen.push(q);
    db.on("query", listener);
    await noteById(db, { ownerId: 3, id: 3 });
    db.removeListener("query", listener);
    expect(seen).toHaveLength(1);
    expect(seen[0]!.sql).toMatch(/from `notes` as `n`/);
    expect(seen[0]!.bindings).toEqual([3, 3, 1]);
  });

  test("see every committed write at once", async () => {
    const before = await notesOf(db, { ownerId: 3, minScore: 0, tag: "hood" });
    await db("notes").insert({ owner_id: 3, tag: "hood", score: 10, body: "late" });
    expect((await notesOf(db, { ownerId: 3, minScore: 0, tag: "hood" })).length).toBe(before.length + 1);
  });

  test("inside a transaction run through Knex, so they see the transaction's own writes", async () => {
    // Rolled back by throwing this; any failed expectation inside rejects with its own error instead.
    const rollBack = new Error("roll back");
    await expect(
      db.transaction(async (trx) => {
        const [row] = await trx("notes").insert({ owner_id: 2, tag: "draft", score: 49, body: "uncommitted" }).returning("id");
        const id = typeof row === "object" ? (row as { id: number }).id : (row as number);
        expect(await noteById(trx, { ownerId: 2, id })).toEqual({ id, body: "uncommitted", owner_name: "Owner 2" });
        // Outside the transaction the write is not visible yet.
        expect(await noteById(db, { ownerId: 2, id })).toBeUndefined();
        throw rollBack;
      }),
    ).rejects.toBe(rollBack);
  });

  test("refuse a query that does not bind a parameter, or writes it into the SQL text", async () => {
    const captured = 2;
    const unbound = compiledRead("all", (knex, p: { ownerId: number }) => knex("notes").where({ owner_id: captured }).select("id").limit(p.ownerId > -1 ? 3 : 4));
    await expect(unbound(db, { ownerId: 1 })).rejects.toThrow(/parameter ownerId is not bound/);
    const inlined = compiledRead("all", (knex, p: { tag: string }) => knex("notes").whereRaw(`tag = '${p.tag}'`).orWhere("tag", p.tag).select("id"));
    await expect(inlined(db, { tag: "flue" })).rejects.toThrow(/parameter tag is written into the SQL text/);
  });

  test("without a read-only connection (an in-memory database) run through Knex", async () => {
    const memory = knexFactory(buildKnexConfig({ sqliteFile: ":memory:" }));
    try {
      expect(readOnlyConnectionOf(memory)).toBeNull();
      await memory.schema.createTable("owners", (t) => {
        t.increments("id");
        t.string("name");
      });
      await memory.schema.createTable("notes", (t) => {
        t.increments("id");
        t.integer("owner_id");
        t.string("body");
      });
      await memory("owners").insert({ name: "Solo" });
      await memory("notes").insert({ owner_id: 1, body: "only" });
      expect(await noteById(memory, { ownerId: 1, id: 1 })).toEqual({ id: 1, body: "only", owner_name: "Solo" });
    } finally {
      await memory.destroy();
    }
  });
});
