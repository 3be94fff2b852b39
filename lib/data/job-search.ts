import type { Knex } from "knex";
import { queryTrigrams, trigramsOf } from "../search/trigrams";
import { containsPattern } from "./like";

/** The job columns the search matches, in the order the trigram index reads them. */
export const JOB_SEARCH_COLUMNS = ["customer_name", "site_street", "site_city", "reference"] as const;

const INSERT_BATCH = 300;

/**
 * Rewrites the search trigrams of the given jobs from what the jobs table holds now. Call it in
 * the transaction that inserted or changed them (createJob, updateJob, the seeds), so the search
 * never sees a job without its trigrams.
 */
export async function indexJobSearch(trx: Knex | Knex.Transaction, jobIds: readonly number[]): Promise<void> {
  for (let i = 0; i < jobIds.length; i += INSERT_BATCH) {
    const ids = jobIds.slice(i, i + INSERT_BATCH);
    await trx("job_search_trigrams").whereIn("job_id", ids).delete();
    const jobs: ({ id: number; company_id: number } & Record<(typeof JOB_SEARCH_COLUMNS)[number], string>)[] = await trx("jobs")
      .whereIn("id", ids)
      .select("id", "company_id", ...JOB_SEARCH_COLUMNS);
    const rows = jobs.flatMap((j) => trigramsOf(JOB_SEARCH_COLUMNS.map((c) => j[c] ?? "")).map((trigram) => ({ company_id: j.company_id, trigram, job_id: j.id })));
    for (let k = 0; k < rows.length; k += INSERT_BATCH) await trx("job_search_trigrams").insert(rows.slice(k, k + INSERT_BATCH));
  }
}

/**
 * How a search for a text finds its candidate jobs:
 * - `scan`: the text is shorter than a trigram, so every job of the company is tested;
 * - `none`: one of its trigrams is held by no job of the company, so no job can match;
 * - `trigram`: the jobs holding its rarest trigram are the ones to test.
 *
 * One trigram is enough to narrow: the LIKE that follows is the exact test. Taking the rarest
 * reads the fewest jobs, and it is cheaper than intersecting all of the text's trigrams, which made
 * SQLite gather and group every (trigram, job) row of each of them (0.5 ms for "brook" on 10,000
 * jobs, against 0.35 ms for the candidates of one trigram with the LIKE; bench/db-queries).
 */
export type JobTextSearchPlan = { kind: "scan" } | { kind: "none" } | { kind: "trigram"; trigram: string };

/**
 * Each trigram's jobs are counted up to this many: enough to tell a rare trigram from a common one
 * without reading every entry of the common ones ("yar" of every "Yard" has thousands).
 */
const TRIGRAM_COUNT_CAP = 500;

export async function planJobTextSearch(db: Knex | Knex.Transaction, args: { companyId: number; text: string }): Promise<JobTextSearchPlan> {
  const grams = queryTrigrams(args.text);
  if (grams.length === 0) return { kind: "scan" };
  // One statement: for each trigram (by its position k), how many jobs hold it, up to the cap;
  // each count is a short walk along the (company_id, trigram, job_id) key.
  const countOf = (k: number) =>
    db
      .select(db.raw(`${k} as k`))
      .count({ n: "*" })
      .from(db("job_search_trigrams").where({ company_id: args.companyId, trigram: grams[k]! }).select("job_id").limit(TRIGRAM_COUNT_CAP).as(`c${k}`));
  const counts: { k: number | string; n: number | string }[] = await countOf(0).unionAll(grams.slice(1).map((_, i) => countOf(i + 1)));
  let rarest = { k: 0, n: Infinity };
  for (const row of counts) {
    const n = Number(row.n);
    if (n === 0) return { kind: "none" };
    if (n < rarest.n) rarest = { k: Number(row.k), n };
  }
  return { kind: "trigram", trigram: grams[rarest.k]! };
}

/**
 * The company's jobs (`jobs as j`) that hold the plan's trigram, read one by id: for a count and
 * for a page of few matches. The unary + keeps SQLite from walking the company's index instead and
 * testing each job (SQLite docs, "The SQLite Query Optimizer Overview", unary + on a term;
 * PostgreSQL reads `+x` as `x`). A page of many matches is quicker along the sorted index with the
 * LIKE alone (jobsOfCompany), so the caller chooses.
 */
export function candidateJobs(db: Knex | Knex.Transaction, args: { companyId: number; plan: Extract<JobTextSearchPlan, { kind: "trigram" }>; alias?: string }): Knex.QueryBuilder {
  const alias = args.alias ?? "j";
  return db(`jobs as ${alias}`)
    .whereRaw(`+${alias}.company_id = ?`, [args.companyId])
    .whereIn(`${alias}.id`, db("job_search_trigrams").where({ company_id: args.companyId, trigram: args.plan.trigram }).select("job_id"));
}

/**
 * Narrows `query` (a builder over `jobs as <alias>`) to the jobs whose `columns` contain `text`,
 * exactly as `LIKE '%text%'` does. `columns` must be among JOB_SEARCH_COLUMNS.
 */
export function whereJobTextMatches(query: Knex.QueryBuilder, args: { alias: string; text: string; columns: readonly (typeof JOB_SEARCH_COLUMNS)[number][] }): void {
  const like = containsPattern(args.text);
  query.andWhere((w) => {
    for (const column of args.columns) w.orWhereRaw(`${args.alias}.${column} like ? escape '\\'`, [like]);
  });
}
