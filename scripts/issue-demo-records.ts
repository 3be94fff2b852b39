/**
 * Gives every approved demo inspection its signed PDF record, as approval does in the app
 * (demo inspections are seeded directly in the approved state). Run with the react-server
 * condition, so the server-only data modules load outside Next: see scripts/prepare-db.ts.
 */
import { getDb } from "../db/knex";
import { insertRecord, prepareRecord } from "../lib/data/records";

async function main() {
  const db = getDb();
  const pending = await db("inspections as i")
    .leftJoin("records as r", "r.inspection_id", "i.id")
    .where("i.status", "approved")
    .whereNull("r.id")
    .select("i.id", "i.company_id", "i.supervisor_signed_name", "i.supervisor_signature_png", "i.approved_at", "i.approved_by");
  for (const row of pending) {
    const prepared = await prepareRecord({
      companyId: row.company_id,
      inspectionId: row.id,
      baseUrl: process.env.PUBLIC_BASE_URL ?? `http://localhost:${process.env.PORT ?? 3000}`,
      approval: { signedName: row.supervisor_signed_name ?? "", signaturePng: row.supervisor_signature_png ?? "", approvedAt: row.approved_at },
    });
    await db.transaction((trx) => insertRecord(trx, { companyId: row.company_id, inspectionId: row.id, actor: { userId: row.approved_by, name: row.supervisor_signed_name ?? "" }, prepared }));
  }
  if (pending.length) console.log(`[db] issued ${pending.length} demo record(s)`);
  await db.destroy();
}

main().catch((error) => {
  console.error("[db] could not issue the demo records:", error);
  process.exit(1);
});
