import type { Knex } from "knex";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestDatabase, insertCompany } from "@/tests/fixtures/test-db";
import { jobListQuerySchema } from "@/lib/schemas/job";

type DataModule = typeof import("@/lib/data/jobs");

let db: Knex;
let cleanup: () => Promise<void>;
let data: DataModule;
let companyA: number;
let companyB: number;

interface SeedJob {
  id: number;
  company_id: number;
  reference: string;
  customer_name: string;
  site_street: string;
  site_city: string;
  updated_at: string;
}
const seeded: SeedJob[] = [];

beforeAll(async () => {
  const test = await createTestDatabase();
  db = test.db;
  cleanup = test.cleanup;
  process.env.FLUEWARD_DB_FILE = test.file;
  data = await import("@/lib/data/jobs");
  companyA = await insertCompany(db, "Test Heating A");
  companyB = await insertCompany(db, "Test Heating B");
  // 300 jobs in company A: "Brook" is common (every 3rd), "Quillon" rare (3 jobs, spread out),
  // "Ashgrove" in the city of 25; company B has Quillons of its own that must never show.
  for (let n = 0; n < 300; n++) {
    const name = n % 3 === 0 ? `Brook ${n}` : [7, 152, 293].includes(n) ? `Quillon ${n}` : `Marsh ${n}`;
    const row = {
      company_id: companyA,
      reference: `JB-${String(n).padStart(4, "0")}`,
      customer_name: name,
      site_street: `${n} Field Row`,
      site_city: n % 12 === 0 ? "Ashgrove" : "Lowmere",
      status: "scheduled",
      created_at: "2026-11-01T00:00:00.000Z",
      // Distinct, shuffled update times, so the sort is not the insertion order.
      updated_at: new Date(Date.UTC(2026, 10, 1) + ((n * 7919) % 300) * 60_000).toISOString(),
    };
    const [id] = await db("jobs").insert(row).returning("id");
    seeded.push({ ...row, id: typeof id === "object" ? (id as { id: number }).id : (id as number) });
  }
  for (let n = 0; n < 5; n++) {
    await db("jobs").insert({ company_id: companyB, reference: `JB-B${n}`, customer_name: `Quillon B${n}`, site_street: "1 Other Way", site_city: "Lowmere", status: "scheduled", created_at: "2026-11-01T00:00:00.000Z", updated_at: "2026-11-02T00:00:00.000Z" });
  }
});

afterAll(async () => {
  const { getDb } = await import("@/db/knex");
  await getDb().destroy();
  await cleanup();
});

/** The expected page, worked out in plain code from the seeded rows. */
function expectedPage(q: string, page: number, pageSize: number) {
  const needle = q.toLowerCase();
  const matches = seeded
    .filter((j) => j.company_id === companyA)
    .filter((j) => [j.customer_name, j.site_street, j.site_city, j.reference].some((v) => v.toLowerCase().includes(needle)))
    .sort((a, b) => (a.updated_at === b.updated_at ? b.id - a.id : a.updated_at < b.updated_at ? 1 : -1));
  return { total: matches.length, ids: matches.slice((page - 1) * pageSize, page * pageSize).map((j) => j.id) };
}

async function list(q: string, page = 1, pageSize = 20) {
  const query = jobListQuerySchema.parse({ q, page: String(page), pageSize: String(pageSize) });
  return data.listJobs({ companyId: companyA, userId: 0, query });
}

describe("jobs list search", () => {
  it.each([
    ["common matches, first page", "brook", 1],
    ["common matches, a later page", "brook", 4],
    ["rare matches spread through the list", "quillon", 1],
    ["a city", "ashgrove", 1],
    ["the last page of a city", "ashgrove", 2],
    ["a reference", "JB-0152", 1],
  ])("%s: the same jobs, in the same order, as a plain filter and sort", async (_label, q, page) => {
    const result = await list(q, page);
    const expected = expectedPage(q, page, 20);
    expect(result.total).toBe(expected.total);
    expect(result.items.map((j) => j.id)).toEqual(expected.ids);
    expect(result.items.length).toBeGreaterThan(0);
  });

  it("finds the three rare matches of this company only, newest first", async () => {
    const result = await list("Quillon");
    expect(result.items.map((j) => j.customerName).sort()).toEqual(["Quillon 152", "Quillon 293", "Quillon 7"]);
    expect(result.items.every((j) => !j.customerName.includes("B"))).toBe(true);
  });

  it("answers a search with no match with an empty first page", async () => {
    expect(await list("zzzz-nothing")).toMatchObject({ items: [], total: 0, page: 1, pageCount: 1 });
  });

  it("treats % and _ in the search as text, not as wildcards", async () => {
    expect((await list("%")).total).toBe(0);
    expect((await list("_")).total).toBe(0);
  });
});
