import type { Knex } from "knex";
import { DEFAULT_SITE_CHECK_ITEMS } from "../../lib/site-checks/defaults";

/** Each demo company starts with the default site-check list, as a new company would on first use. */
export async function seed(knex: Knex): Promise<void> {
  await knex("site_check_items").del();
  const companies = await knex("companies").select("id");
  const now = new Date().toISOString();
  for (const { id: companyId } of companies) {
    await knex("site_check_items").insert(
      DEFAULT_SITE_CHECK_ITEMS.map((item, index) => ({
        company_id: companyId,
        key: item.key,
        label: item.label,
        help: item.help,
        applies_to: item.appliesTo,
        sort_order: index,
        active: true,
        created_at: now,
        updated_at: now,
      })),
    );
  }
}
