import type { Knex } from "knex";
import { trigramsOf } from "../../lib/search/trigrams";

/**
 * The jobs search's trigram table (see lib/search/trigrams.ts): one row per distinct trigram of a
 * job's customer name, street, city and reference. The primary key starts with the company and the
 * trigram, so the jobs holding a trigram are one index range. Kept by lib/data/job-search.ts in
 * the transaction that writes the job; filled here for the jobs that already exist.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("job_search_trigrams", (t) => {
    t.integer("company_id").notNullable();
    t.string("trigram", 16).notNullable();
    t.integer("job_id").notNullable().references("id").inTable("jobs").onDelete("CASCADE");
    t.primary(["company_id", "trigram", "job_id"]);
    t.index(["job_id"], "job_search_trigrams_job_id_index");
  });
  let after = 0;
  for (;;) {
    const jobs: { id: number; company_id: number; customer_name: string; site_street: string; site_city: string; reference: string }[] = await knex("jobs")
      .where("id", ">", after)
      .orderBy("id")
      .limit(500)
      .select("id", "company_id", "customer_name", "site_street", "site_city", "reference");
    if (jobs.length === 0) break;
    const rows = jobs.flatMap((j) => trigramsOf([j.customer_name, j.site_street, j.site_city, j.reference]).map((trigram) => ({ company_id: j.company_id, trigram, job_id: j.id })));
    for (let i = 0; i < rows.length; i += 300) await knex("job_search_trigrams").insert(rows.slice(i, i + 300));
    after = jobs[jobs.length - 1]!.id;
  }
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("job_search_trigrams");
}
