import type { Knex } from "knex";

/**
 * Inspections (each revision its own row, chained to the one it corrects), their comments,
 * photos, and the company's list of site-check items.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("inspections", (t) => {
    t.increments("id").primary();
    t.integer("company_id").notNullable().references("id").inTable("companies").onDelete("CASCADE");
    t.integer("job_id").notNullable().references("id").inTable("jobs").onDelete("CASCADE");
    // draft → submitted → (returned → submitted)* → approved; an approved one is superseded by its next revision's approval.
    t.string("status", 20).notNullable();
    t.integer("revision").notNullable().defaultTo(1);
    t.integer("root_inspection_id").nullable();
    t.integer("previous_inspection_id").nullable().references("id").inTable("inspections").onDelete("SET NULL");
    t.integer("rulebook_version_id").notNullable().references("id").inTable("rulebook_versions").onDelete("RESTRICT");
    t.text("data_json").notNullable();
    t.text("findings_json").notNullable().defaultTo("[]");
    t.text("summary_json").notNullable().defaultTo("{}");
    t.integer("version").notNullable().defaultTo(1);
    t.integer("created_by").nullable().references("id").inTable("users").onDelete("SET NULL");
    t.integer("installer_id").nullable().references("id").inTable("users").onDelete("SET NULL");
    t.string("installer_signed_name", 200).nullable();
    t.text("installer_signature_png").nullable();
    t.string("submitted_at", 40).nullable();
    t.integer("approved_by").nullable().references("id").inTable("users").onDelete("SET NULL");
    t.string("supervisor_signed_name", 200).nullable();
    t.text("supervisor_signature_png").nullable();
    t.string("approved_at", 40).nullable();
    t.string("superseded_at", 40).nullable();
    t.string("created_at", 40).notNullable();
    t.string("updated_at", 40).notNullable();
    t.index(["company_id", "status", "submitted_at"]);
    t.index(["company_id", "job_id"]);
    t.index(["company_id", "root_inspection_id"]);
  });

  await knex.schema.createTable("inspection_comments", (t) => {
    t.increments("id").primary();
    t.integer("company_id").notNullable().references("id").inTable("companies").onDelete("CASCADE");
    t.integer("inspection_id").notNullable().references("id").inTable("inspections").onDelete("CASCADE");
    t.string("section", 40).notNullable();
    t.string("kind", 20).notNullable().defaultTo("comment");
    t.text("body").notNullable();
    t.integer("author_id").nullable().references("id").inTable("users").onDelete("SET NULL");
    t.string("author_name", 200).notNullable().defaultTo("");
    t.string("created_at", 40).notNullable();
    t.index(["company_id", "inspection_id"]);
  });

  await knex.schema.createTable("photos", (t) => {
    t.increments("id").primary();
    t.integer("company_id").notNullable().references("id").inTable("companies").onDelete("CASCADE");
    t.integer("inspection_id").notNullable().references("id").inTable("inspections").onDelete("CASCADE");
    t.string("storage_key", 200).notNullable();
    t.string("thumb_key", 200).notNullable();
    t.string("content_type", 50).notNullable();
    t.integer("width").notNullable();
    t.integer("height").notNullable();
    t.integer("bytes").notNullable();
    t.string("sha256", 64).notNullable();
    t.string("caption", 300).notNullable().defaultTo("");
    t.string("tag", 20).notNullable().defaultTo("none");
    t.string("segment_id", 100).nullable();
    t.string("site_check_key", 100).nullable();
    t.integer("created_by").nullable().references("id").inTable("users").onDelete("SET NULL");
    t.string("created_at", 40).notNullable();
    t.string("deleted_at", 40).nullable();
    t.index(["company_id", "inspection_id"]);
  });

  await knex.schema.createTable("site_check_items", (t) => {
    t.increments("id").primary();
    t.integer("company_id").notNullable().references("id").inTable("companies").onDelete("CASCADE");
    t.string("key", 100).notNullable();
    t.string("label", 300).notNullable();
    t.string("help", 1000).notNullable().defaultTo("");
    // all | condensing | draft_hood | natural_draft
    t.string("applies_to", 30).notNullable().defaultTo("all");
    t.integer("sort_order").notNullable().defaultTo(0);
    t.boolean("active").notNullable().defaultTo(true);
    t.string("created_at", 40).notNullable();
    t.string("updated_at", 40).notNullable();
    t.unique(["company_id", "key"]);
    t.index(["company_id", "active", "sort_order"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("site_check_items");
  await knex.schema.dropTableIfExists("photos");
  await knex.schema.dropTableIfExists("inspection_comments");
  await knex.schema.dropTableIfExists("inspections");
}
