import type { Knex } from "knex";

/**
 * Rulebooks and their immutable versions. A version's content is the whole table set as JSON
 * text; editing never updates a version row, it inserts the next one.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("rulebooks", (t) => {
    t.increments("id").primary();
    t.integer("company_id").notNullable().references("id").inTable("companies").onDelete("CASCADE");
    t.string("name", 200).notNullable();
    t.string("description", 1000).notNullable().defaultTo("");
    t.string("status", 20).notNullable().defaultTo("active");
    t.integer("latest_version_number").notNullable().defaultTo(0);
    t.integer("created_by").nullable().references("id").inTable("users").onDelete("SET NULL");
    t.string("created_at", 40).notNullable();
    t.string("updated_at", 40).notNullable();
    t.index(["company_id", "status"]);
  });

  await knex.schema.createTable("rulebook_versions", (t) => {
    t.increments("id").primary();
    t.integer("company_id").notNullable().references("id").inTable("companies").onDelete("CASCADE");
    t.integer("rulebook_id").notNullable().references("id").inTable("rulebooks").onDelete("CASCADE");
    t.integer("version_number").notNullable();
    t.string("change_note", 500).notNullable().defaultTo("");
    t.text("content_json").notNullable();
    t.string("content_sha256", 64).notNullable();
    t.integer("created_by").nullable().references("id").inTable("users").onDelete("SET NULL");
    t.string("created_at", 40).notNullable();
    t.unique(["rulebook_id", "version_number"]);
    t.index(["company_id", "rulebook_id"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex("companies").update({ default_rulebook_id: null });
  await knex.schema.dropTableIfExists("rulebook_versions");
  await knex.schema.dropTableIfExists("rulebooks");
}
