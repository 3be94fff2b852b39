import "server-only";
import type { Knex } from "knex";
import { getDb } from "@/db/knex";
import { AppError } from "@/lib/errors";
import { DEFAULT_SITE_CHECK_ITEMS, type SiteCheckAppliesTo, type SiteCheckItemDefinition } from "@/lib/site-checks";
import type { SafetyFlag } from "@/lib/venting";
import { recordAudit, type AuditActor } from "./audit";
import { nowIso } from "./clock";

/** One item of a company's site-check list, as the app sees it. */
export interface SiteCheckItem {
  id: number;
  key: string;
  label: string;
  help: string;
  appliesTo: SiteCheckAppliesTo;
  active: boolean;
  sortOrder: number;
  /** One of the items every company starts with (its basis and caution come with it). */
  isDefault: boolean;
  commonPractice: boolean;
  safety: SafetyFlag | null;
  createdAt: string;
  updatedAt: string;
}

const COLUMNS = ["id", "key", "label", "help", "applies_to", "active", "sort_order", "created_at", "updated_at"];
const SYSTEM_ACTOR: AuditActor = { userId: null, name: "Flueward" };
const DEFAULTS_BY_KEY: ReadonlyMap<string, SiteCheckItemDefinition> = new Map(DEFAULT_SITE_CHECK_ITEMS.map((item) => [item.key, item]));

function toItem(row: Record<string, unknown>): SiteCheckItem {
  const key = row.key as string;
  const known = DEFAULTS_BY_KEY.get(key);
  return {
    id: row.id as number,
    key,
    label: row.label as string,
    help: row.help as string,
    appliesTo: row.applies_to as SiteCheckAppliesTo,
    active: Boolean(row.active),
    sortOrder: row.sort_order as number,
    isDefault: known !== undefined,
    commonPractice: known?.commonPractice ?? false,
    safety: known?.safety ?? null,
    createdAt: row.created_at as string,
    updatedAt: row.updated_at as string,
  };
}

function auditShape(item: SiteCheckItem) {
  return { label: item.label, help: item.help, appliesTo: item.appliesTo, active: item.active, sortOrder: item.sortOrder };
}

/**
 * Gives a company the default list if it has no items yet. Safe to call on every read: it does
 * nothing once the company has any item, and a concurrent call cannot insert a key twice.
 */
export async function ensureDefaultSiteCheckItems(args: { companyId: number }): Promise<void> {
  const db = getDb();
  const any = await db("site_check_items").where({ company_id: args.companyId }).first("id");
  if (any) return;
  await db.transaction(async (trx) => {
    const again = await trx("site_check_items").where({ company_id: args.companyId }).first("id");
    if (again) return;
    const now = nowIso();
    await trx("site_check_items")
      .insert(
        DEFAULT_SITE_CHECK_ITEMS.map((item, index) => ({
          company_id: args.companyId,
          key: item.key,
          label: item.label,
          help: item.help,
          applies_to: item.appliesTo,
          sort_order: index,
          active: true,
          created_at: now,
          updated_at: now,
        })),
      )
      .onConflict(["company_id", "key"])
      .ignore();
    await recordAudit(trx, {
      companyId: args.companyId,
      actor: SYSTEM_ACTOR,
      action: "site_check.defaults_added",
      entityType: "site_check_item",
      entityId: null,
      summary: `Started the site-check list with ${DEFAULT_SITE_CHECK_ITEMS.length} default items`,
    });
  });
}

/** The company's site-check list in its order; inactive items only when asked for. */
export async function listSiteCheckItems(args: { companyId: number; includeInactive?: boolean }): Promise<SiteCheckItem[]> {
  await ensureDefaultSiteCheckItems({ companyId: args.companyId });
  const q = getDb()("site_check_items")
    .where({ company_id: args.companyId })
    .orderBy([
      { column: "sort_order", order: "asc" },
      { column: "id", order: "asc" },
    ]);
  if (!args.includeInactive) q.andWhere({ active: true });
  return (await q.select(COLUMNS)).map(toItem);
}

async function findItem(db: Knex | Knex.Transaction, companyId: number, id: number): Promise<SiteCheckItem> {
  const row = await db("site_check_items").where({ company_id: companyId, id }).first(COLUMNS);
  if (!row) throw new AppError("not_found", "No such site-check item in your company.");
  return toItem(row);
}

export async function getSiteCheckItem(args: { companyId: number; id: number }): Promise<SiteCheckItem> {
  return findItem(getDb(), args.companyId, args.id);
}

/** A stable snake_case key from the label, unique within the company. */
async function uniqueKey(trx: Knex.Transaction, companyId: number, label: string): Promise<string> {
  const base =
    label
      .toLowerCase()
      .normalize("NFKD")
      .replace(/[^a-z0-9]+/g, "_")
      .replace(/^_+|_+$/g, "")
      .slice(0, 60)
      .replace(/_+$/, "") || "item";
  const taken = new Set(
    (await trx("site_check_items").where({ company_id: companyId }).andWhere("key", "like", `${base}%`).pluck("key")) as string[],
  );
  if (!taken.has(base)) return base;
  for (let n = 2; ; n++) if (!taken.has(`${base}_${n}`)) return `${base}_${n}`;
}

/** Adds an item at the end of the list. */
export async function createSiteCheckItem(args: { companyId: number; actor: AuditActor; label: string; help: string; appliesTo: SiteCheckAppliesTo }): Promise<SiteCheckItem> {
  await ensureDefaultSiteCheckItems({ companyId: args.companyId });
  const id = await getDb().transaction(async (trx) => {
    const key = await uniqueKey(trx, args.companyId, args.label);
    const last = (await trx("site_check_items").where({ company_id: args.companyId }).max({ max: "sort_order" }).first()) as { max: number | null } | undefined;
    const now = nowIso();
    const [inserted] = await trx("site_check_items")
      .insert({
        company_id: args.companyId,
        key,
        label: args.label,
        help: args.help,
        applies_to: args.appliesTo,
        sort_order: (last?.max ?? -1) + 1,
        active: true,
        created_at: now,
        updated_at: now,
      })
      .returning("id");
    const itemId = typeof inserted === "object" ? (inserted as { id: number }).id : (inserted as number);
    await recordAudit(trx, {
      companyId: args.companyId,
      actor: args.actor,
      action: "site_check.created",
      entityType: "site_check_item",
      entityId: itemId,
      summary: `Added site check: ${args.label}`,
      after: { key, label: args.label, help: args.help, appliesTo: args.appliesTo },
    });
    return itemId;
  });
  return getSiteCheckItem({ companyId: args.companyId, id });
}

/** Changes an item's wording, applicability, active flag or position. The key never changes. */
export async function updateSiteCheckItem(args: {
  companyId: number;
  actor: AuditActor;
  id: number;
  label?: string;
  help?: string;
  appliesTo?: SiteCheckAppliesTo;
  active?: boolean;
  sortOrder?: number;
}): Promise<SiteCheckItem> {
  await getDb().transaction(async (trx) => {
    const before = await findItem(trx, args.companyId, args.id);
    const changes: Record<string, unknown> = {};
    if (args.label !== undefined) changes.label = args.label;
    if (args.help !== undefined) changes.help = args.help;
    if (args.appliesTo !== undefined) changes.applies_to = args.appliesTo;
    if (args.active !== undefined) changes.active = args.active;
    if (args.sortOrder !== undefined) changes.sort_order = args.sortOrder;
    await trx("site_check_items").where({ company_id: args.companyId, id: args.id }).update({ ...changes, updated_at: nowIso() });
    const after = await findItem(trx, args.companyId, args.id);
    const parts: string[] = [];
    if (after.label !== before.label) parts.push("wording");
    if (after.help !== before.help) parts.push("help");
    if (after.appliesTo !== before.appliesTo) parts.push(`applies to ${before.appliesTo} → ${after.appliesTo}`);
    if (after.active !== before.active) parts.push(after.active ? "reactivated" : "deactivated");
    if (after.sortOrder !== before.sortOrder) parts.push("position");
    await recordAudit(trx, {
      companyId: args.companyId,
      actor: args.actor,
      action: args.active === false && before.active ? "site_check.deactivated" : "site_check.updated",
      entityType: "site_check_item",
      entityId: args.id,
      summary: `${after.label}: ${parts.join(", ") || "no change"}`,
      before: auditShape(before),
      after: auditShape(after),
    });
  });
  return getSiteCheckItem({ companyId: args.companyId, id: args.id });
}

/**
 * Puts the whole list in a new order. `ids` must name every item of the company once; an id of
 * another company is `not_found`, and a list that no longer matches is a `conflict`.
 */
export async function reorderSiteCheckItems(args: { companyId: number; actor: AuditActor; ids: number[] }): Promise<SiteCheckItem[]> {
  await getDb().transaction(async (trx) => {
    const current = (await trx("site_check_items").where({ company_id: args.companyId }).pluck("id")) as number[];
    const known = new Set(current);
    if (args.ids.some((id) => !known.has(id))) throw new AppError("not_found", "No such site-check item in your company.");
    if (args.ids.length !== current.length) throw new AppError("conflict", "The list changed since you opened it. Reload to see the current list.");
    const now = nowIso();
    for (const [index, id] of args.ids.entries()) {
      await trx("site_check_items").where({ company_id: args.companyId, id }).update({ sort_order: index, updated_at: now });
    }
    await recordAudit(trx, {
      companyId: args.companyId,
      actor: args.actor,
      action: "site_check.reordered",
      entityType: "site_check_item",
      entityId: null,
      summary: `Reordered the site-check list (${args.ids.length} items)`,
      after: { ids: args.ids },
    });
  });
  return listSiteCheckItems({ companyId: args.companyId, includeInactive: true });
}
