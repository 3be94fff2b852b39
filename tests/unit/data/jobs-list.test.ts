import fc from "fast-check";
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
  // Written directly, so indexed for the search directly (createJob and updateJob do both).
  const { indexJobSearch } = await import("@/lib/data/job-search");
  await indexJobSearch(db, (await db("jobs").select("id")).map((j: { id: number }) => j.id));
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

  // Matches above 20 × the page's end: the search walks the sorted jobs instead of sorting its
  // candidates (listJobs). Both ways must give the plain filter's answer.
  it.each([
    ["common matches walked, first page", "brook", 1, 4],
    ["common matches walked, a later page", "brook", 3, 1],
    ["a city walked", "lowmere", 2, 5],
  ])("%s: the same jobs as a plain filter and sort", async (_label, q, page, pageSize) => {
    const result = await list(q, page, pageSize);
    const expected = expectedPage(q, page, pageSize);
    expect(expected.total).toBeGreaterThanOrEqual(page * pageSize * 20);
    expect(result.total).toBe(expected.total);
    expect(result.items.map((j) => j.id)).toEqual(expected.ids);
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

describe("search by trigrams gives exactly what a LIKE scan gives", () => {
  const WORDS = ["Brook", "brook's End", "Zoë Brönte", "ÅSA Öberg", "50% Lane", "under_score Row", "Ashgrove", "Fennick", "Quill", "Rowan Quillfeather", "JB-C0042"];
  let companyC: number;
  let actor: { userId: number; name: string };

  beforeAll(async () => {
    companyC = await insertCompany(db, "Test Heating C");
    const [user] = await db("users")
      .insert({ company_id: companyC, email: "c@test.test", name: "C Admin", role: "admin", password_hash: "x", active: true, password_changed_at: "2026-11-01T00:00:00.000Z", created_at: "2026-11-01T00:00:00.000Z", updated_at: "2026-11-01T00:00:00.000Z" })
      .returning("id");
    actor = { userId: typeof user === "object" ? (user as { id: number }).id : (user as number), name: "C Admin" };
    const { jobFormSchema } = await import("@/lib/schemas/job");
    // Created through createJob, which indexes each job in its own transaction.
    for (let n = 0; n < 40; n++) {
      const pick = (k: number) => WORDS[(n * 7 + k * 3) % WORDS.length]!;
      await data.createJob({ companyId: companyC, actor, values: jobFormSchema.parse({ customerName: `${pick(1)} ${n}`, siteStreet: `${n} ${pick(2)}`, siteCity: pick(3) }) });
    }
  });

  /** The LIKE scan the search used before its trigram index: the reference answer. */
  async function byLikeScan(q: string) {
    const like = `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    const rows: { id: number }[] = await db("jobs")
      .where("company_id", companyC)
      .andWhere((w) => {
        for (const c of ["customer_name", "site_street", "site_city", "reference"]) w.orWhereRaw(`${c} like ? escape '\\'`, [like]);
      })
      .orderBy([{ column: "updated_at", order: "desc" }, { column: "id", order: "desc" }])
      .select("id");
    return rows.map((r) => r.id);
  }

  it("property: any piece of the stored texts, in any ASCII case, or any string at all", async () => {
    const texts = (await db("jobs").where("company_id", companyC).select("customer_name", "site_street", "site_city", "reference")).flatMap((r: Record<string, string>) => Object.values(r));
    const piece = fc.tuple(fc.constantFrom(...texts), fc.nat(), fc.integer({ min: 1, max: 10 }), fc.boolean()).map(([t, a, len, upper]) => {
      const chars = Array.from(t);
      const cut = chars.slice(a % chars.length, (a % chars.length) + len).join("");
      return upper ? cut.toUpperCase() : cut;
    });
    await fc.assert(
      fc.asyncProperty(fc.oneof(piece, fc.string({ maxLength: 6 })), async (q) => {
        const query = jobListQuerySchema.parse({ q, pageSize: "100" });
        const result = await data.listJobs({ companyId: companyC, userId: 0, query });
        const expected = await byLikeScan(query.q);
        expect(result.total).toBe(expected.length);
        expect(result.items.map((j) => j.id)).toEqual(expected.slice(0, 100));
      }),
      { numRuns: 150 },
    );
  });

  it("an edited job is found by its new name and no longer by its old one", async () => {
    const { jobUpdateSchema, jobFormSchema } = await import("@/lib/schemas/job");
    const job = await data.createJob({ companyId: companyC, actor, values: jobFormSchema.parse({ customerName: "Philippa Vantongeren", siteStreet: "3 Moss Row", siteCity: "Fennick" }) });
    const search = async (q: string) => (await data.listJobs({ companyId: companyC, userId: 0, query: jobListQuerySchema.parse({ q }) })).items.map((j) => j.id);
    expect(await search("vantongeren")).toEqual([job.id]);
    await data.updateJob({ companyId: companyC, id: job.id, actor, mayAssign: true, values: jobUpdateSchema.parse({ customerName: "Philippa Marlowe-Oake", siteStreet: "3 Moss Row", siteCity: "Fennick", version: job.version }) });
    expect(await search("vantongeren")).toEqual([]);
    expect(await search("marlowe-oake")).toEqual([job.id]);
    // The trigram table holds this job's current texts only.
    const grams = (await db("job_search_trigrams").where("job_id", job.id).pluck("trigram")) as string[];
    expect(grams).toContain("oak");
    expect(grams).not.toContain("ton");
  });
});
