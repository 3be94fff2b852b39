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
 * The company's jobs (`jobs as j`), for a query that will search `text`. With `candidatesFirst`,
 * and a text long enough for trigrams, SQLite reads the trigram candidates one by id instead of
 * walking the company's index and testing each job: the unary + keeps it from choosing that
 * index (SQLite docs, "The SQLite Query Optimizer Overview", unary + on a term; PostgreSQL reads
 * `+x` as `x`). Right for a count and for a few matches; a page of many matches is quicker along
 * the sorted index, so the caller chooses.
 */
export function jobsForTextSearch(db: Knex | Knex.Transaction, args: { companyId: number; text: string; candidatesFirst: boolean }): Knex.QueryBuilder {
  if (args.candidatesFirst && queryTrigrams(args.text).length > 0) return db("jobs as j").whereRaw("+j.company_id = ?", [args.companyId]);
  return db("jobs as j").where("j.company_id", args.companyId);
}

/** True when a search for `text` can use the trigram index (it is at least a trigram long). */
export function searchUsesTrigrams(text: string): boolean {
  return queryTrigrams(text).length > 0;
}

/**
 * Narrows `query` (a builder over `jobs as <alias>`) to the jobs whose `columns` contain `text`,
 * as `LIKE '%text%'` would: by the trigram index first when the text is long enough, then the
 * LIKE itself on those candidates only. `columns` must be among JOB_SEARCH_COLUMNS.
 */
export function whereJobTextMatches(
  db: Knex | Knex.Transaction,
  query: Knex.QueryBuilder,
  args: { alias: string; companyId: number; text: string; columns: readonly (typeof JOB_SEARCH_COLUMNS)[number][] },
): void {
  const grams = queryTrigrams(args.text);
  if (grams.length > 0) {
    query.whereIn(
      `${args.alias}.id`,
      db("job_search_trigrams").where("company_id", args.companyId).whereIn("trigram", grams).groupBy("job_id").havingRaw("count(*) = ?", [grams.length]).select("job_id"),
    );
  }
  const like = containsPattern(args.text);
  query.andWhere((w) => {
    for (const column of args.columns) w.orWhereRaw(`${args.alias}.${column} like ? escape '\\'`, [like]);
  });
}
