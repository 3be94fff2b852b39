import type { Knex } from "knex";

/**
 * Each company's number of jobs, kept beside the id of its newest job (lib/data/job-totals.ts):
 * the unfiltered jobs list shows the total, and counting 10,000 index entries took about 0.4 ms of
 * every such request. The total is trusted only while `last_job_id` is still the company's
 * newest job id, which the index on (company_id, id) finds in one seek; otherwise the list counts.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("job_totals", (t) => {
    t.integer("company_id").primary().references("id").inTable("companies").onDelete("CASCADE");
    t.integer("job_count").notNullable();
    t.integer("last_job_id").notNullable();
  });
  await knex.schema.alterTable("jobs", (t) => {
    t.index(["company_id", "id"], "jobs_company_id_id_index");
  });
  const totals = (await knex("jobs").select("company_id").count({ job_count: "*" }).max({ last_job_id: "id" }).groupBy("company_id")) as {
    company_id: number;
    job_count: number | string;
    last_job_id: number;
  }[];
  for (const row of totals) {
    await knex("job_totals").insert({ company_id: row.company_id, job_count: Number(row.job_count), last_job_id: row.last_job_id });
  }
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("jobs", (t) => {
    t.dropIndex(["company_id", "id"], "jobs_company_id_id_index");
  });
  await knex.schema.dropTable("job_totals");
}
