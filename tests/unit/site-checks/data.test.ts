import type { Knex } from "knex";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestDatabase, insertCompany } from "@/tests/fixtures/test-db";
import { DEFAULT_SITE_CHECK_ITEMS } from "@/lib/site-checks";

type DataModule = typeof import("@/lib/data/site-checks");

let db: Knex;
let cleanup: () => Promise<void>;
let data: DataModule;
let companyA: number;
let companyB: number;
const actor = { userId: null, name: "Test admin" };

beforeAll(async () => {
  const test = await createTestDatabase();
  db = test.db;
  cleanup = test.cleanup;
  // db/knex.ts reads the file name on first use, so the data module is loaded only after this.
  process.env.FLUEWARD_DB_FILE = test.file;
  data = await import("@/lib/data/site-checks");
  companyA = await insertCompany(db, "Test Heating A");
  companyB = await insertCompany(db, "Test Heating B");
});

afterAll(async () => {
  const { getDb } = await import("@/db/knex");
  await getDb().destroy();
  await cleanup();
});

describe("site-check items", () => {
  it("gives a company the defaults on first read, once", async () => {
    const first = await data.listSiteCheckItems({ companyId: companyA });
    expect(first.map((i) => i.key)).toEqual(DEFAULT_SITE_CHECK_ITEMS.map((i) => i.key));
    await data.listSiteCheckItems({ companyId: companyA });
    await data.ensureDefaultSiteCheckItems({ companyId: companyA });
    expect(await db("site_check_items").where({ company_id: companyA }).count({ n: "*" }).first()).toEqual({ n: DEFAULT_SITE_CHECK_ITEMS.length });
    const audits = await db("audit_events").where({ company_id: companyA, action: "site_check.defaults_added" });
    expect(audits).toHaveLength(1);
    expect(first[0]).toMatchObject({ isDefault: true, active: true, sortOrder: 0, commonPractice: true });
  });

  it("updates wording, applicability and the active flag, and audits the change", async () => {
    const [item] = await data.listSiteCheckItems({ companyId: companyA });
    const updated = await data.updateSiteCheckItem({ companyId: companyA, actor, id: item!.id, label: "Every joint has its screws", appliesTo: "natural_draft", active: false });
    expect(updated).toMatchObject({ id: item!.id, key: item!.key, label: "Every joint has its screws", appliesTo: "natural_draft", active: false });
    expect((await data.listSiteCheckItems({ companyId: companyA })).map((i) => i.id)).not.toContain(item!.id);
    expect((await data.listSiteCheckItems({ companyId: companyA, includeInactive: true })).map((i) => i.id)).toContain(item!.id);
    const audit = await db("audit_events").where({ company_id: companyA, action: "site_check.deactivated", entity_id: item!.id }).first();
    expect(JSON.parse(audit.before_json)).toMatchObject({ active: true, appliesTo: "all" });
    expect(JSON.parse(audit.after_json)).toMatchObject({ active: false, appliesTo: "natural_draft" });
  });

  it("adds an item at the end with a key made from its label, unique within the company", async () => {
    const a = await data.createSiteCheckItem({ companyId: companyA, actor, label: "Flue pipe painted? No — labelled!", help: "", appliesTo: "all" });
    const b = await data.createSiteCheckItem({ companyId: companyA, actor, label: "Flue pipe painted, no: labelled", help: "Second one", appliesTo: "condensing" });
    expect(a.key).toBe("flue_pipe_painted_no_labelled");
    expect(b.key).toBe("flue_pipe_painted_no_labelled_2");
    expect(a.isDefault).toBe(false);
    const all = await data.listSiteCheckItems({ companyId: companyA, includeInactive: true });
    expect(all.slice(-2).map((i) => i.id)).toEqual([a.id, b.id]);
    expect(await db("audit_events").where({ company_id: companyA, action: "site_check.created" })).toHaveLength(2);
  });

  it("keeps companies apart: another company's item is not found", async () => {
    const itemsB = await data.listSiteCheckItems({ companyId: companyB });
    expect(itemsB).toHaveLength(DEFAULT_SITE_CHECK_ITEMS.length);
    const [itemA] = await data.listSiteCheckItems({ companyId: companyA });
    await expect(data.updateSiteCheckItem({ companyId: companyB, actor, id: itemA!.id, label: "Taken over" })).rejects.toMatchObject({ code: "not_found" });
    await expect(data.getSiteCheckItem({ companyId: companyB, id: itemA!.id })).rejects.toMatchObject({ code: "not_found" });
    const idsB = itemsB.map((i) => i.id);
    await expect(data.reorderSiteCheckItems({ companyId: companyB, actor, ids: [itemA!.id, ...idsB.slice(1)] })).rejects.toMatchObject({ code: "not_found" });
    expect((await data.getSiteCheckItem({ companyId: companyA, id: itemA!.id })).label).not.toBe("Taken over");
    // A new company's own list is untouched by the other's edits.
    expect(itemsB.every((i) => i.active && i.appliesTo === DEFAULT_SITE_CHECK_ITEMS.find((d) => d.key === i.key)!.appliesTo)).toBe(true);
  });

  it("reorders the whole list, and refuses a list that no longer matches", async () => {
    const before = await data.listSiteCheckItems({ companyId: companyB, includeInactive: true });
    const ids = before.map((i) => i.id).reverse();
    const after = await data.reorderSiteCheckItems({ companyId: companyB, actor, ids });
    expect(after.map((i) => i.id)).toEqual(ids);
    await expect(data.reorderSiteCheckItems({ companyId: companyB, actor, ids: ids.slice(1) })).rejects.toMatchObject({ code: "conflict" });
  });
});
