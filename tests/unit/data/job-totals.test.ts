import type { Knex } from "knex";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { createTestDatabase, insertCompany } from "@/tests/fixtures/test-db";
import { jobFormSchema, jobListQuerySchema } from "@/lib/schemas/job";

/**
 * The kept job totals (lib/data/job-totals.ts): the unfiltered jobs list's total must always
 * equal a real count, whether the jobs came through createJob or were written directly.
 */
type Jobs = typeof import("@/lib/data/jobs");
type Totals = typeof import("@/lib/data/job-totals");

let db: Knex;
let cleanup: () => Promise<void>;
let jobs: Jobs;
let totals: Totals;
let companyA: number;
let companyB: number;
let actor: { userId: number; name: string };

const realCount = async (companyId: number) => Number((await db("jobs").where({ company_id: companyId }).count<{ n: number }[]>({ n: "*" }).first())?.n);
const keptRow = (companyId: number) => db("job_totals").where({ company_id: companyId }).first("job_count", "last_job_id");
const listTotal = async (companyId: number) => (await jobs.listJobs({ companyId, userId: actor.userId, query: jobListQuerySchema.parse({}) })).total;

beforeAll(async () => {
  const t = await createTestDatabase();
  db = t.db;
  cleanup = t.cleanup;
  process.env.FLUEWARD_DB_FILE = t.file;
  jobs = await import("@/lib/data/jobs");
  totals = await import("@/lib/data/job-totals");
  companyA = await insertCompany(db, "Totals Heating A");
  companyB = await insertCompany(db, "Totals Heating B");
  const [user] = await db("users")
    .insert({ company_id: companyA, email: "t@test.test", name: "T Admin", role: "admin", password_hash: "x", active: true, password_changed_at: "2026-11-01T00:00:00.000Z", created_at: "2026-11-01T00:00:00.000Z", updated_at: "2026-11-01T00:00:00.000Z" })
    .returning("id");
  actor = { userId: typeof user === "object" ? (user as { id: number }).id : (user as number), name: "T Admin" };
});

afterAll(async () => {
  const { getDb } = await import("@/db/knex");
  await getDb().destroy();
  await cleanup();
});

const create = (companyId: number, n: number) => jobs.createJob({ companyId, actor, values: jobFormSchema.parse({ customerName: `Totals ${n}`, siteStreet: `${n} Count Row`, siteCity: "Tallyford" }) });
const insertDirectly = async (companyId: number, n: number) => {
  await db("jobs").insert({ company_id: companyId, reference: `JT-${companyId}-${n}`, customer_name: `Direct ${n}`, site_street: "1 Raw Row", site_city: "Tallyford", status: "scheduled", created_at: "2026-11-01T00:00:00.000Z", updated_at: "2026-11-01T00:00:00.000Z" });
};

describe("job totals", () => {
  test("a company without jobs counts 0", async () => {
    expect(await listTotal(companyA)).toBe(0);
    expect(await keptRow(companyA)).toBeUndefined();
  });

  test("createJob keeps the company's total and newest id, and the list reads them", async () => {
    for (let n = 0; n < 5; n++) await create(companyA, n);
    const newest = (await db("jobs").where({ company_id: companyA }).max({ m: "id" }).first())!.m as number;
    expect(await keptRow(companyA)).toEqual({ job_count: 5, last_job_id: newest });
    expect(await listTotal(companyA)).toBe(5);
    // The kept total is what the list reads: change it by hand and the list follows.
    await db("job_totals").where({ company_id: companyA }).update({ job_count: 4242 });
    expect(await totals.countCompanyJobs((await import("@/db/knex")).getDb(), companyA)).toBe(4242);
    await totals.refreshJobTotals(db, [companyA]);
    expect(await listTotal(companyA)).toBe(5);
  });

  test("a job written directly makes the kept total stale, and the list counts instead: never a wrong total", async () => {
    await insertDirectly(companyA, 1);
    expect((await keptRow(companyA))!.job_count).toBe(5);
    expect(await listTotal(companyA)).toBe(6);
    expect(await realCount(companyA)).toBe(6);
  });

  test("mixed writes in two companies: every total equals a real count", async () => {
    for (let step = 0; step < 30; step++) {
      const companyId = step % 3 === 0 ? companyB : companyA;
      if (step % 4 === 1) await insertDirectly(companyId, 100 + step);
      else await create(companyId, 100 + step);
      expect(await listTotal(companyA)).toBe(await realCount(companyA));
      expect(await listTotal(companyB)).toBe(await realCount(companyB));
    }
    expect(await realCount(companyB)).toBeGreaterThan(5);
  });

  test("filtered lists still count the matching jobs", async () => {
    const query = jobListQuerySchema.parse({ status: "scheduled" });
    const scheduled = Number((await db("jobs").where({ company_id: companyA, status: "scheduled" }).count<{ n: number }[]>({ n: "*" }).first())?.n);
    expect((await jobs.listJobs({ companyId: companyA, userId: actor.userId, query })).total).toBe(scheduled);
  });
});
