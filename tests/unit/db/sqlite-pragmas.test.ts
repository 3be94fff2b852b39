import fs from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import type { Knex } from "knex";
import { SQLITE_BUSY_TIMEOUT_MS, buildKnexConfig } from "@/db/config";
import { MIGRATIONS } from "@/db/migration-source";
import { createTestDatabase } from "../../fixtures/test-db";

describe("SQLite connection settings", () => {
  let db: Knex;
  let cleanup: () => Promise<void>;
  beforeAll(async () => {
    ({ db, cleanup } = await createTestDatabase());
  });
  afterAll(async () => cleanup());

  test("every connection runs WAL, synchronous=FULL, foreign keys on and a busy timeout", async () => {
    const first = async (sql: string) => Object.values(((await db.raw(sql)) as Record<string, unknown>[])[0]!)[0];
    expect(String(await first("PRAGMA journal_mode")).toLowerCase()).toBe("wal");
    // synchronous: 0 OFF, 1 NORMAL, 2 FULL, 3 EXTRA (sqlite.org/pragma.html#pragma_synchronous)
    expect(await first("PRAGMA synchronous")).toBe(2);
    expect(await first("PRAGMA foreign_keys")).toBe(1);
    expect(await first("PRAGMA busy_timeout")).toBe(SQLITE_BUSY_TIMEOUT_MS);
  });

  test("foreign keys are enforced: a job for a missing company is refused", async () => {
    await expect(
      db("jobs").insert({ company_id: 999, reference: "J-1", customer_name: "x", site_street: "x", site_city: "x", status: "scheduled", created_at: "t", updated_at: "t" }),
    ).rejects.toThrow(/FOREIGN KEY/);
  });

  test("every company-owned table carries company_id", async () => {
    for (const table of ["users", "sessions", "jobs", "audit_events", "rulebooks", "rulebook_versions"]) {
      expect(await db.schema.hasColumn(table, "company_id"), table).toBe(true);
    }
  });

  test("the static migration list matches the migrations folder", () => {
    const files = fs.readdirSync(path.join(process.cwd(), "db", "migrations")).filter((f) => f.endsWith(".ts")).sort();
    expect(Object.keys(MIGRATIONS).sort()).toEqual(files);
  });

  test("DATABASE_URL with postgres:// selects PostgreSQL with the same migrations", () => {
    const config = buildKnexConfig({ databaseUrl: "postgres://flueward@db.internal/flueward" });
    const sqlite = buildKnexConfig({ sqliteFile: ":memory:" });
    expect(config.client).toBe("pg");
    expect(config.connection).toBe("postgres://flueward@db.internal/flueward");
    expect(config.migrations).toEqual(sqlite.migrations);
  });

  test("the default SQLite file lives under the git-ignored data/ folder", () => {
    const config = buildKnexConfig();
    expect((config.connection as { filename: string }).filename).toMatch(/[/\\]data[/\\][^/\\]+\.sqlite$/);
    expect(fs.readFileSync(path.join(process.cwd(), ".gitignore"), "utf8")).toMatch(/^\/data\/$/m);
  });
});
