import path from "node:path";
import type { Knex } from "knex";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { createTestDatabase } from "../../fixtures/test-db";
import { buildInspectionWorld } from "../../fixtures/inspection-world";
import { inspectionListQuerySchema } from "@/lib/schemas/inspection";

type Inspections = typeof import("@/lib/data/inspections");

let db: Knex;
let cleanup: () => Promise<void>;
let inspections: Inspections;
let world: Awaited<ReturnType<typeof buildInspectionWorld>>;
const ids: Record<string, number> = {};

beforeAll(async () => {
  const t = await createTestDatabase();
  db = t.db;
  cleanup = t.cleanup;
  process.env.FLUEWARD_DB_FILE = t.file;
  process.env.FLUEWARD_UPLOADS_DIR = path.join(path.dirname(t.file), "uploads");
  inspections = await import("@/lib/data/inspections");
  world = await buildInspectionWorld(db);
  const now = new Date().toISOString();
  // Company A: the world's job ("Test Customer", J-0001) and a second job for "Wren Halloway".
  const [wren] = await db("jobs")
    .insert({ company_id: world.a.companyId, reference: "J-0777", customer_name: "Wren Halloway", site_street: "2 Test Lane", site_city: "Testville", status: "scheduled", created_at: now, updated_at: now })
    .returning("id");
  const wrenJobId = typeof wren === "object" ? (wren as { id: number }).id : (wren as number);
  const { indexJobSearch } = await import("@/lib/data/job-search");
  await indexJobSearch(db, [wrenJobId]);
  ids.a1 = (await inspections.createInspection({ member: world.a.installer, jobId: world.a.jobId })).id;
  ids.wren = (await inspections.createInspection({ member: world.a.installer, jobId: wrenJobId })).id;
  // Company B's inspection is on a job whose customer shares the search term.
  await db("jobs").where({ id: world.b.jobId }).update({ customer_name: "Wren Otherco" });
  await indexJobSearch(db, [world.b.jobId]);
  ids.b1 = (await inspections.createInspection({ member: world.b.installer, jobId: world.b.jobId })).id;
});

afterAll(async () => {
  const { getDb } = await import("@/db/knex");
  await getDb().destroy();
  await cleanup();
});

async function search(q: string, companyId = world.a.companyId) {
  const result = await inspections.listInspections({ companyId, query: inspectionListQuerySchema.parse({ status: "all", q }) });
  return { total: result.total, ids: result.items.map((i) => i.id).sort((x, y) => x - y) };
}

describe("inspection list search", () => {
  test("matches the customer's name, the job reference and the installer's name", async () => {
    expect(await search("halloway")).toEqual({ total: 1, ids: [ids.wren] });
    expect(await search("J-0777")).toEqual({ total: 1, ids: [ids.wren] });
    expect(await search("Installer")).toEqual({ total: 2, ids: [ids.a1!, ids.wren!].sort((x, y) => x - y) });
  });

  test("never finds another company's inspections, even when their text matches", async () => {
    expect(await search("wren")).toEqual({ total: 1, ids: [ids.wren] });
    expect(await search("wren", world.b.companyId)).toEqual({ total: 1, ids: [ids.b1] });
    // Company B's installer is named "Installer <id of B>": company A must not see B's rows by it.
    expect((await search(`Installer ${world.b.companyId}`)).total).toBe(0);
  });

  test("treats % and _ as text and answers no match with an empty page", async () => {
    expect(await search("%")).toEqual({ total: 0, ids: [] });
    expect(await search("_")).toEqual({ total: 0, ids: [] });
    expect(await search("zzzz")).toEqual({ total: 0, ids: [] });
  });

  test("without a search, the count is the company's inspections of that status only", async () => {
    const count = async (status: string, companyId: number) => (await inspections.listInspections({ companyId, query: inspectionListQuerySchema.parse({ status }) })).total;
    expect(await count("all", world.a.companyId)).toBe(2);
    expect(await count("draft", world.a.companyId)).toBe(2);
    expect(await count("submitted", world.a.companyId)).toBe(0);
    expect(await count("all", world.b.companyId)).toBe(1);
  });
});
