import type { Knex } from "knex";

/**
 * Signed records (one per approved inspection revision, immutable PDF bytes in blob storage with
 * their SHA-256), share links for people outside the company with an access log, and e-mails
 * sent with their outcome.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("records", (t) => {
    t.increments("id").primary();
    t.integer("company_id").notNullable().references("id").inTable("companies").onDelete("CASCADE");
    t.integer("inspection_id").notNullable().references("id").inTable("inspections").onDelete("RESTRICT");
    t.integer("root_inspection_id").notNullable();
    t.integer("revision").notNullable();
    t.string("verification_code", 40).notNullable().unique();
    t.string("pdf_key", 200).notNullable();
    t.integer("pdf_bytes").notNullable();
    t.string("sha256", 64).notNullable();
    // valid | superseded | revoked
    t.string("status", 20).notNullable().defaultTo("valid");
    t.integer("superseded_by_record_id").nullable();
    t.string("revoked_at", 40).nullable();
    t.string("revoked_reason", 300).nullable();
    t.string("installer_name", 200).notNullable();
    t.string("supervisor_name", 200).notNullable();
    t.string("submitted_at", 40).notNullable();
    t.string("approved_at", 40).notNullable();
    t.string("created_at", 40).notNullable();
    t.unique(["inspection_id"]);
    t.index(["company_id", "root_inspection_id"]);
  });

  await knex.schema.createTable("share_links", (t) => {
    t.increments("id").primary();
    t.integer("company_id").notNullable().references("id").inTable("companies").onDelete("CASCADE");
    t.integer("record_id").notNullable().references("id").inTable("records").onDelete("CASCADE");
    // Only the SHA-256 of the token is stored; the token itself is shown once.
    t.string("token_hash", 64).notNullable().unique();
    t.string("audience", 20).notNullable();
    t.string("label", 200).notNullable().defaultTo("");
    t.string("expires_at", 40).notNullable();
    t.string("revoked_at", 40).nullable();
    t.integer("created_by").nullable().references("id").inTable("users").onDelete("SET NULL");
    t.string("created_at", 40).notNullable();
    t.index(["company_id", "record_id"]);
  });

  await knex.schema.createTable("share_link_accesses", (t) => {
    t.increments("id").primary();
    t.integer("company_id").notNullable().references("id").inTable("companies").onDelete("CASCADE");
    t.integer("share_link_id").notNullable().references("id").inTable("share_links").onDelete("CASCADE");
    // view | download | refused_expired | refused_revoked
    t.string("action", 30).notNullable();
    t.string("client", 100).notNullable().defaultTo("");
    t.string("user_agent", 300).notNullable().defaultTo("");
    t.string("created_at", 40).notNullable();
    t.index(["company_id", "share_link_id"]);
  });

  await knex.schema.createTable("email_sends", (t) => {
    t.increments("id").primary();
    t.integer("company_id").notNullable().references("id").inTable("companies").onDelete("CASCADE");
    t.integer("record_id").notNullable().references("id").inTable("records").onDelete("CASCADE");
    t.integer("share_link_id").nullable().references("id").inTable("share_links").onDelete("SET NULL");
    // The browser's key for one press of "Send": a second press with the same key sends nothing.
    t.string("idempotency_key", 100).notNullable();
    t.string("to_address", 254).notNullable();
    t.string("subject", 300).notNullable();
    t.boolean("attach_pdf").notNullable().defaultTo(false);
    // sending | sent | failed
    t.string("status", 20).notNullable();
    t.integer("attempts").notNullable().defaultTo(0);
    t.string("last_error", 500).nullable();
    t.string("message_id", 300).nullable();
    t.integer("created_by").nullable().references("id").inTable("users").onDelete("SET NULL");
    t.string("created_at", 40).notNullable();
    t.string("updated_at", 40).notNullable();
    t.unique(["company_id", "idempotency_key"]);
    t.index(["company_id", "record_id"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("email_sends");
  await knex.schema.dropTableIfExists("share_link_accesses");
  await knex.schema.dropTableIfExists("share_links");
  await knex.schema.dropTableIfExists("records");
}
