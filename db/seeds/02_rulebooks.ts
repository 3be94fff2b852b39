import crypto from "node:crypto";
import type { Knex } from "knex";
import { STARTER_RULEBOOK, STARTER_RULEBOOK_NAME } from "./data/starter-rulebook";

/**
 * Each demo company gets the starter rulebook as version 1 and as its current rulebook. Its code
 * values are entered from memory and its capacity table is invented demo data; both say so in
 * every citation, and the rulebook screens show those labels.
 */
export async function seed(knex: Knex): Promise<void> {
  const companies = await knex("companies").select("id");
  for (const { id: companyId } of companies) {
    const author = await knex("users").where({ company_id: companyId, role: "admin" }).first("id");
    const now = new Date().toISOString();
    const [inserted] = await knex("rulebooks")
      .insert({
        company_id: companyId,
        name: STARTER_RULEBOOK_NAME,
        description: "Code values from memory of commonly published fuel-gas codes, and an invented demo capacity table. Copy it and enter your adopted edition's values before relying on it.",
        status: "active",
        latest_version_number: 1,
        created_by: author?.id ?? null,
        created_at: now,
        updated_at: now,
      })
      .returning("id");
    const rulebookId = typeof inserted === "object" ? inserted.id : inserted;
    const json = JSON.stringify(STARTER_RULEBOOK);
    await knex("rulebook_versions").insert({
      company_id: companyId,
      rulebook_id: rulebookId,
      version_number: 1,
      change_note: "Starter values seeded with the demo",
      content_json: json,
      content_sha256: crypto.createHash("sha256").update(json).digest("hex"),
      created_by: author?.id ?? null,
      created_at: now,
    });
    await knex("companies").where({ id: companyId }).update({ default_rulebook_id: rulebookId });
  }
}
