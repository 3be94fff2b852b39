import type { Knex } from "knex";

/**
 * Covering indexes for the inspection lists (review queue and the "all" view). An inspection row
 * carries its data, findings and signatures (several kB, spilling onto overflow pages), so a
 * count or a sort that has to visit each row to read `job_id` or `installer_id` costs a page read
 * per inspection: about 120 ms for 8,000 submitted inspections and 300 ms for 50,000. With those
 * two columns in the index, counts and the first page are answered from the index alone.
 * The new status index extends the old one (same leading columns), so the old one is dropped.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("inspections", (t) => {
    t.dropIndex(["company_id", "status", "submitted_at"]);
    t.index(["company_id", "status", "submitted_at", "job_id", "installer_id"]);
    t.index(["company_id", "submitted_at", "job_id", "installer_id"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("inspections", (t) => {
    t.dropIndex(["company_id", "submitted_at", "job_id", "installer_id"]);
    t.dropIndex(["company_id", "status", "submitted_at", "job_id", "installer_id"]);
    t.index(["company_id", "status", "submitted_at"]);
  });
}
