import type { Knex } from "knex";
import bcrypt from "bcryptjs";
import { indexJobSearch } from "../../lib/data/job-search";
import { refreshJobTotals } from "../../lib/data/job-totals";

/**
 * Demo data: an invented scenario. Two invented companies in invented towns, so that isolation
 * between companies can be seen and tested. No real person, company, address or brand.
 */
export const DEMO_PASSWORDS = {
  installer: "ember-trowel-lantern",
  supervisor: "copper-meadow-ledger",
  admin: "quiet-harbor-compass",
  other: "willow-anvil-journey",
} as const;

const NOW = new Date();
function daysAgo(n: number): string {
  return new Date(NOW.getTime() - n * 86_400_000).toISOString();
}
function dateIn(n: number): string {
  return new Date(NOW.getTime() + n * 86_400_000).toISOString().slice(0, 10);
}

export async function seed(knex: Knex): Promise<void> {
  // Children first; rulebook and inspection tables may not exist yet on an older schema.
  for (const table of ["site_check_items", "photos", "inspection_comments", "inspections"]) {
    if (await knex.schema.hasTable(table)) await knex(table).del();
  }
  if (await knex.schema.hasTable("job_search_trigrams")) await knex("job_search_trigrams").del();
  if (await knex.schema.hasTable("job_totals")) await knex("job_totals").del();
  for (const table of ["audit_events", "login_attempts", "sessions", "jobs"]) await knex(table).del();
  if (await knex.schema.hasTable("rulebook_versions")) {
    await knex("companies").update({ default_rulebook_id: null });
    await knex("rulebook_versions").del();
    await knex("rulebooks").del();
  }
  await knex("users").del();
  await knex("companies").del();

  const created = daysAgo(30);
  const [kettlewick] = await knex("companies")
    .insert({
      name: "Kettlewick Heating & Cooling",
      licence_number: "MC-00417 (demo)",
      phone: "555-0142",
      email: "office@kettlewick.test",
      address: "88 Tinder Row, Ambervale",
      created_at: created,
      updated_at: created,
    })
    .returning("id");
  const [northgale] = await knex("companies")
    .insert({
      name: "Northgale Mechanical",
      licence_number: "MC-00981 (demo)",
      phone: "555-0199",
      email: "desk@northgale.test",
      address: "3 Slate Quay, Fernhollow",
      created_at: created,
      updated_at: created,
    })
    .returning("id");
  const companyA = typeof kettlewick === "object" ? kettlewick.id : kettlewick;
  const companyB = typeof northgale === "object" ? northgale.id : northgale;

  const hash = (password: string) => bcrypt.hashSync(password, 11);
  const user = (companyId: number, email: string, name: string, role: string, password: string, active = true) => ({
    company_id: companyId,
    email,
    name,
    role,
    password_hash: hash(password),
    active,
    must_change_password: false,
    password_changed_at: created,
    created_at: created,
    updated_at: created,
  });

  const insertUser = async (row: ReturnType<typeof user>): Promise<number> => {
    const [inserted] = await knex("users").insert(row).returning("id");
    return typeof inserted === "object" ? inserted.id : inserted;
  };

  const installerId = await insertUser(user(companyA, "installer@flueward.test", "Tamsin Wexley", "installer", DEMO_PASSWORDS.installer));
  const supervisorId = await insertUser(user(companyA, "supervisor@flueward.test", "Arlo Brennick", "supervisor", DEMO_PASSWORDS.supervisor));
  await insertUser(user(companyA, "admin@flueward.test", "Marguerite Solvang", "admin", DEMO_PASSWORDS.admin));
  const secondInstallerId = await insertUser(user(companyA, "juniper.installer@flueward.test", "Juniper Ashcombe", "installer", DEMO_PASSWORDS.installer));
  await insertUser(user(companyA, "former.installer@flueward.test", "Oswin Farrant", "installer", DEMO_PASSWORDS.installer, false));

  const otherInstallerId = await insertUser(user(companyB, "installer@northgale.test", "Cyril Dunmore", "installer", DEMO_PASSWORDS.other));
  await insertUser(user(companyB, "admin@northgale.test", "Hattie Quell", "admin", DEMO_PASSWORDS.other));

  const job = (companyId: number, n: number, fields: Record<string, unknown>) => ({
    company_id: companyId,
    reference: `J-${String(n).padStart(4, "0")}`,
    customer_phone: "",
    customer_email: "",
    site_region: "",
    site_postal_code: "",
    notes: "",
    version: 1,
    created_at: daysAgo(20 - n),
    updated_at: daysAgo(10 - n),
    ...fields,
  });

  await knex("jobs").insert([
    job(companyA, 1, {
      customer_name: "Priya Holloway-Teague",
      customer_email: "priya.ht@homeowner.test",
      customer_phone: "555-0110",
      site_street: "14 Quillfeather Lane",
      site_city: "Ambervale",
      site_postal_code: "AV1 4QF",
      status: "completed",
      assigned_installer_id: installerId,
      scheduled_for: dateIn(-9),
      notes: "80,000 Btu/h furnace replaced; water heater kept on the common vent.",
      created_by: supervisorId,
    }),
    job(companyA, 2, {
      customer_name: "Bartholomew Crane",
      customer_phone: "555-0123",
      site_street: "2 Millrace Court, Flat 3",
      site_city: "Ambervale",
      status: "awaiting_review",
      assigned_installer_id: installerId,
      scheduled_for: dateIn(-2),
      notes: "Boiler swap in basement; check combustion air, room is small.",
      created_by: supervisorId,
    }),
    job(companyA, 3, {
      customer_name: "Odette Marchbank",
      customer_email: "odette.m@homeowner.test",
      site_street: "51 Gorse Hill Road",
      site_city: "Little Ambervale",
      status: "in_progress",
      assigned_installer_id: installerId,
      scheduled_for: dateIn(0),
      notes: "Water heater replacement; existing single-wall connector runs through the attic hatch area.",
      created_by: installerId,
    }),
    job(companyA, 4, {
      customer_name: "Felix and Wren Abernathy",
      site_street: "7 Lantern Yard",
      site_city: "Ambervale",
      status: "scheduled",
      assigned_installer_id: secondInstallerId,
      scheduled_for: dateIn(3),
      created_by: supervisorId,
    }),
    job(companyA, 5, {
      customer_name: "Cressida Vale",
      site_street: "120 Orchard Terrace",
      site_city: "Ambervale",
      status: "scheduled",
      assigned_installer_id: null,
      scheduled_for: dateIn(6),
      notes: "Quote visit: furnace and water heater, possible chimney liner.",
      created_by: supervisorId,
    }),
    job(companyA, 7, {
      customer_name: "Ilse Marrow-Finch",
      site_street: "17 Tansy Row",
      site_city: "Ambervale",
      status: "in_progress",
      assigned_installer_id: installerId,
      scheduled_for: dateIn(0),
      notes: "Furnace replacement; the water heater shares the vent.",
      created_by: supervisorId,
    }),
    job(companyA, 6, {
      customer_name: "Ignatius Pellow",
      site_street: "9 Weir Cottages",
      site_city: "Ambervale",
      status: "cancelled",
      assigned_installer_id: null,
      created_by: supervisorId,
    }),
    job(companyB, 1, {
      customer_name: "Marisol Penhallow",
      site_street: "40 Kelp Street",
      site_city: "Fernhollow",
      status: "in_progress",
      assigned_installer_id: otherInstallerId,
      scheduled_for: dateIn(1),
      notes: "Northgale's own job: must never be visible to Kettlewick.",
      created_by: otherInstallerId,
    }),
    job(companyB, 2, {
      customer_name: "Thaddeus Ormsby",
      site_street: "5 Cormorant Rise",
      site_city: "Fernhollow",
      status: "scheduled",
      assigned_installer_id: otherInstallerId,
      created_by: otherInstallerId,
    }),
  ]);
  // The search finds jobs by their trigrams; the seed writes jobs directly, so it indexes them too.
  await indexJobSearch(knex, (await knex("jobs").select("id")).map((j: { id: number }) => j.id));
  // …and keeps each company's job total, as createJob does.
  await refreshJobTotals(knex, (await knex("companies").select("id")).map((c: { id: number }) => c.id));
}
