import type { Knex } from "knex";
import { compiledRead } from "../../db/compiled-read";

/**
 * How many jobs a company has, without counting them on every request.
 *
 * `job_totals` holds each company's job count with the id of its newest job when it was counted.
 * A count is trusted only while that id is still the company's newest (one index seek on
 * jobs(company_id, id)): a job inserted without `refreshJobTotals` (a seed, a test, a script)
 * makes it stale, and then the jobs are counted as before, so a forgotten refresh costs time,
 * never a wrong total. Jobs are never deleted except with their company (which drops its row);
 * code that comes to delete single jobs must refresh in the same transaction.
 */
export async function refreshJobTotals(db: Knex | Knex.Transaction, companyIds: readonly number[]): Promise<void> {
  for (const companyId of new Set(companyIds)) {
    const row = (await db("jobs").where("company_id", companyId).count({ n: "*" }).max({ last: "id" }).first()) as { n: number | string; last: number | null } | undefined;
    await db("job_totals").where("company_id", companyId).delete();
    if (row?.last != null) await db("job_totals").insert({ company_id: companyId, job_count: Number(row.n), last_job_id: row.last });
  }
}

const currentTotal = compiledRead("first", (db, p: { companyId: number }) =>
  db("job_totals as t")
    .where("t.company_id", p.companyId)
    .andWhere("t.last_job_id", db("jobs as j").where("j.company_id", p.companyId).max("j.id"))
    .first("t.job_count"),
);

/** Every job of the company, counted or read from a current total. */
export async function countCompanyJobs(db: Knex, companyId: number): Promise<number> {
  const total = await currentTotal(db, { companyId });
  if (total) return Number(total.job_count);
  const counted = await db("jobs").where("company_id", companyId).count<{ n: number | string }[]>({ n: "*" }).first();
  return Number(counted?.n ?? 0);
}
