/** Drops every table (rolling back all migrations), migrates again and seeds the demo data. */
import knexFactory from "knex";
import { buildKnexConfig } from "../db/config";
import { issueDemoRecords } from "./lib/demo-records";

async function main() {
  const db = knexFactory(buildKnexConfig());
  try {
    await db.migrate.rollback(undefined, true);
    await db.migrate.latest();
    await db.seed.run();
    console.log("[db] reset: migrated and seeded");
  } finally {
    await db.destroy();
  }
  issueDemoRecords();
}

main().catch((error) => {
  console.error("[db] reset failed:", error);
  process.exit(1);
});
