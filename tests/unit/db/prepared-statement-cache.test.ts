import Database from "better-sqlite3";
import { afterEach, describe, expect, test } from "vitest";
import { cachePreparedStatements } from "@/db/config";
import { createTestDatabase } from "../../fixtures/test-db";

describe("prepared statements are kept per connection", () => {
  let raw: Database.Database | null = null;
  afterEach(() => raw?.close());

  test("the same SQL text gives back the same statement, which still binds new values", () => {
    raw = new Database(":memory:");
    cachePreparedStatements(raw);
    raw.prepare("create table t (id integer primary key, v text)").run();
    const insert = raw.prepare("insert into t (v) values (?)");
    expect(raw.prepare("insert into t (v) values (?)")).toBe(insert);
    insert.run("a");
    raw.prepare("insert into t (v) values (?)").run("b");
    const select = raw.prepare("select v from t where id = ?");
    expect(select.get(1)).toEqual({ v: "a" });
    expect(raw.prepare("select v from t where id = ?").get(2)).toEqual({ v: "b" });
  });

  test("bounded: past the limit the least recently used text is prepared anew", () => {
    raw = new Database(":memory:");
    cachePreparedStatements(raw, 2);
    const one = raw.prepare("select 1");
    const two = raw.prepare("select 2");
    expect(raw.prepare("select 1")).toBe(one); // "select 1" is now the most recent
    raw.prepare("select 3"); // drops "select 2"
    expect(raw.prepare("select 1")).toBe(one);
    expect(raw.prepare("select 2")).not.toBe(two);
  });

  test("a kept statement sees a schema change made after it was prepared", () => {
    raw = new Database(":memory:");
    cachePreparedStatements(raw);
    raw.prepare("create table t (a integer)").run();
    raw.prepare("insert into t (a) values (1)").run();
    expect(raw.prepare("select * from t").get()).toEqual({ a: 1 });
    raw.prepare("alter table t add column b text default 'x'").run();
    expect(raw.prepare("select * from t").get()).toEqual({ a: 1, b: "x" });
  });

  test("the app's connections use it: queries and transactions give the same answers", async () => {
    const { db, cleanup } = await createTestDatabase();
    try {
      const [company] = await db("companies").insert({ name: "Cache Test Heating", created_at: "2026-12-01T00:00:00Z", updated_at: "2026-12-01T00:00:00Z" }).returning("id");
      const before = await db("jobs").where({ company_id: company.id }).count({ n: "*" }).first();
      for (let i = 0; i < 3; i++) {
        await db.transaction(async (trx) => {
          await trx("jobs").insert({ company_id: company.id, reference: `J-CACHE-${i}`, customer_name: "Cache test", site_street: "1 Test Row", site_city: "Testville", status: "scheduled", created_at: "2026-12-01T00:00:00Z", updated_at: "2026-12-01T00:00:00Z" });
        });
      }
      await expect(db.transaction(async (trx) => {
        await trx("jobs").insert({ company_id: company.id, reference: "J-CACHE-ROLLBACK", customer_name: "x", site_street: "x", site_city: "x", status: "scheduled", created_at: "t", updated_at: "t" });
        throw new Error("roll back");
      })).rejects.toThrow("roll back");
      const after = await db("jobs").where({ company_id: company.id }).count({ n: "*" }).first();
      expect(Number(after?.n) - Number(before?.n)).toBe(3);
      expect(await db("jobs").where({ reference: "J-CACHE-ROLLBACK" }).first()).toBeUndefined();
    } finally {
      await cleanup();
    }
  });
});
