import fs from "node:fs";
import path from "node:path";
import { describe, expect, test } from "vitest";
import knexFactory from "knex";
import { MIGRATIONS } from "@/db/migration-source";

/**
 * Migrations must run on PostgreSQL too. Without a PostgreSQL server here, we render every
 * migration's DDL with Knex's pg dialect (no connection is opened) and check that no migration
 * carries raw, dialect-specific SQL.
 */
describe("migrations are portable between SQLite and PostgreSQL", () => {
  test("no migration uses raw SQL", () => {
    for (const file of fs.readdirSync(path.join(process.cwd(), "db", "migrations"))) {
      const source = fs.readFileSync(path.join(process.cwd(), "db", "migrations", file), "utf8");
      expect(source, file).not.toMatch(/\.raw\(|schema\.raw|PRAGMA|AUTOINCREMENT/i);
    }
  });

  test("every migration renders PostgreSQL DDL", async () => {
    const pg = knexFactory({ client: "pg" });
    const statements: string[] = [];
    const recorder = new Proxy(pg, {}) as typeof pg;
    for (const [name, migration] of Object.entries(MIGRATIONS)) {
      const schemaCalls: string[] = [];
      // A migration that also moves data (a backfill) gets a query builder that answers with no rows.
      const noRows: unknown = new Proxy(() => noRows, {
        get: (_target, key) => (key === "then" ? (resolve: (rows: unknown[]) => void) => resolve([]) : () => noRows),
        apply: () => noRows,
      });
      const fake = Object.assign(() => noRows, {
        schema: {
          createTable: (table: string, build: Parameters<typeof pg.schema.createTable>[1]) => {
            schemaCalls.push(...pg.schema.createTable(table, build).toSQL().map((s) => s.sql));
            return Promise.resolve();
          },
          alterTable: (table: string, build: Parameters<typeof pg.schema.alterTable>[1]) => {
            schemaCalls.push(...pg.schema.alterTable(table, build).toSQL().map((s) => s.sql));
            return Promise.resolve();
          },
        },
      }) as unknown as typeof recorder;
      await migration.up(fake);
      expect(schemaCalls.length, name).toBeGreaterThan(0);
      statements.push(...schemaCalls);
    }
    expect(statements.join("\n")).toContain('create table "companies"');
    expect(statements.join("\n")).toContain('"id" serial primary key');
    await pg.destroy();
  });
});
