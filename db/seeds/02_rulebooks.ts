import crypto from "node:crypto";
import type { Knex } from "knex";
import { STARTER_RULEBOOK, STARTER_RULEBOOK_NAME } from "./data/starter-rulebook";

/**
 * Each demo company gets the starter rulebook as version 1 and as its current rulebook. Each code
 * value's citation names edition and section and says whether it was read in the published text
 * or recalled; its capacity table is invented demo data and says so in every row.
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
        description: "2018 IFGC and IRC fuel-gas values, each row saying whether it was read in the published text or recalled, and an invented demo capacity table. Copy it and enter your adopted edition's values before relying on it.",
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
