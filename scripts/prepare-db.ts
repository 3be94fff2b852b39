/**
 * Brings the database to the latest migration and, when it holds no company yet, seeds the
 * demo data. Run before `next start` / `next dev` (the bundled server cannot load .ts migrations).
 */
import knexFactory from "knex";
import { buildKnexConfig } from "../db/config";
import { issueDemoRecords } from "./lib/demo-records";

async function main() {
  const db = knexFactory(buildKnexConfig());
  let seeded = false;
  try {
    const [, applied] = await db.migrate.latest();
    if (applied.length) console.log(`[db] applied ${applied.length} migration(s)`);
    const row = await db("companies").count<{ n: number | string }[]>({ n: "id" }).first();
    if (Number(row?.n ?? 0) === 0 && process.env.FLUEWARD_SKIP_SEED !== "1") {
      await db.seed.run();
      console.log("[db] seeded demo data");
      seeded = true;
    }
  } finally {
    await db.destroy();
  }
  if (seeded) issueDemoRecords();
}

main().catch((error) => {
  console.error("[db] could not prepare the database:", error);
  process.exit(1);
});
