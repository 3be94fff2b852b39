import type { Knex } from "knex";

/**
 * Companies, their members, server-side sessions, jobs and the audit trail.
 * Portable between SQLite and PostgreSQL: schema builder only, no dialect SQL.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("companies", (t) => {
    t.increments("id").primary();
    t.string("name", 200).notNullable();
    t.string("licence_number", 100).notNullable().defaultTo("");
    t.string("phone", 50).notNullable().defaultTo("");
    t.string("email", 254).notNullable().defaultTo("");
    t.string("address", 500).notNullable().defaultTo("");
    // The rulebook new inspections are checked against. No foreign key: rulebooks come in a
    // later migration, and the data layer only ever sets it to a rulebook of the same company.
    t.integer("default_rulebook_id").nullable();
    t.string("created_at", 40).notNullable();
    t.string("updated_at", 40).notNullable();
  });

  await knex.schema.createTable("users", (t) => {
    t.increments("id").primary();
    t.integer("company_id").notNullable().references("id").inTable("companies").onDelete("RESTRICT");
    t.string("email", 254).notNullable().unique();
    t.string("name", 200).notNullable();
    t.string("password_hash", 100).notNullable();
    t.string("role", 20).notNullable();
    t.boolean("active").notNullable().defaultTo(true);
    t.boolean("must_change_password").notNullable().defaultTo(false);
    t.string("password_changed_at", 40).notNullable();
    t.string("created_at", 40).notNullable();
    t.string("updated_at", 40).notNullable();
    t.index(["company_id", "role"]);
  });

  await knex.schema.createTable("sessions", (t) => {
    // The cookie carries a random id; only its SHA-256 is stored, so a database copy cannot be
    // replayed as a cookie.
    t.string("id_hash", 64).primary();
    t.integer("user_id").notNullable().references("id").inTable("users").onDelete("CASCADE");
    t.integer("company_id").notNullable().references("id").inTable("companies").onDelete("CASCADE");
    t.string("created_at", 40).notNullable();
    t.string("last_seen_at", 40).notNullable();
    t.string("expires_at", 40).notNullable();
    t.string("revoked_at", 40).nullable();
    t.string("revoked_reason", 40).nullable();
    t.string("user_agent", 300).notNullable().defaultTo("");
    t.index(["user_id"]);
  });

  await knex.schema.createTable("jobs", (t) => {
    t.increments("id").primary();
    t.integer("company_id").notNullable().references("id").inTable("companies").onDelete("RESTRICT");
    t.string("reference", 40).notNullable();
    t.string("customer_name", 200).notNullable();
    t.string("customer_phone", 50).notNullable().defaultTo("");
    t.string("customer_email", 254).notNullable().defaultTo("");
    t.string("site_street", 300).notNullable();
    t.string("site_city", 120).notNullable();
    t.string("site_region", 120).notNullable().defaultTo("");
    t.string("site_postal_code", 20).notNullable().defaultTo("");
    t.string("status", 30).notNullable();
    t.integer("assigned_installer_id").nullable().references("id").inTable("users").onDelete("SET NULL");
    t.string("scheduled_for", 10).nullable();
    t.text("notes").notNullable().defaultTo("");
    t.integer("version").notNullable().defaultTo(1);
    t.integer("created_by").nullable().references("id").inTable("users").onDelete("SET NULL");
    t.string("created_at", 40).notNullable();
    t.string("updated_at", 40).notNullable();
    t.unique(["company_id", "reference"]);
    t.index(["company_id", "status", "updated_at"]);
    t.index(["company_id", "updated_at"]);
    t.index(["company_id", "assigned_installer_id"]);
  });

  await knex.schema.createTable("audit_events", (t) => {
    t.increments("id").primary();
    t.integer("company_id").notNullable().references("id").inTable("companies").onDelete("CASCADE");
    t.integer("actor_user_id").nullable().references("id").inTable("users").onDelete("SET NULL");
    t.string("actor_name", 200).notNullable().defaultTo("");
    t.string("action", 60).notNullable();
    t.string("entity_type", 40).notNullable();
    t.integer("entity_id").nullable();
    t.string("summary", 500).notNullable().defaultTo("");
    t.text("before_json").nullable();
    t.text("after_json").nullable();
    t.string("created_at", 40).notNullable();
    t.index(["company_id", "entity_type", "entity_id"]);
    t.index(["company_id", "created_at"]);
  });

  await knex.schema.createTable("login_attempts", (t) => {
    t.increments("id").primary();
    t.string("email", 254).notNullable();
    t.string("client", 100).notNullable();
    t.boolean("succeeded").notNullable();
    t.string("created_at", 40).notNullable();
    t.index(["email", "created_at"]);
    t.index(["client", "created_at"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("login_attempts");
  await knex.schema.dropTableIfExists("audit_events");
  await knex.schema.dropTableIfExists("jobs");
  await knex.schema.dropTableIfExists("sessions");
  await knex.schema.dropTableIfExists("users");
  await knex.schema.dropTableIfExists("companies");
}
