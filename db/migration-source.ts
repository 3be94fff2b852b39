import type { Knex } from "knex";
import * as foundation from "./migrations/20261201000001_foundation";
import * as rulebooks from "./migrations/20261201000002_rulebooks";
import * as inspections from "./migrations/20261201000003_inspections";
import * as records from "./migrations/20261201000004_records";
import * as inspectionListIndexes from "./migrations/20261201000005_inspection_list_indexes";
import * as jobSearchIndex from "./migrations/20261201000006_job_search_index";
import * as jobSearchTrigrams from "./migrations/20261201000007_job_search_trigrams";
import * as jobTotals from "./migrations/20261201000008_job_totals";
import * as signInDevices from "./migrations/20261205000001_sign_in_devices";

/**
 * The migrations as a static list, for runtimes that cannot load .ts files from a folder
 * (plain Vitest). The names match the files, so both sources record the same history.
 * Add each new migration here too (DEVELOPERS.md says so; a unit test checks the folder).
 */
export const MIGRATIONS: Record<string, { up: (knex: Knex) => Promise<void>; down: (knex: Knex) => Promise<void> }> = {
  "20261201000001_foundation.ts": foundation,
  "20261201000002_rulebooks.ts": rulebooks,
  "20261201000003_inspections.ts": inspections,
  "20261201000004_records.ts": records,
  "20261201000005_inspection_list_indexes.ts": inspectionListIndexes,
  "20261201000006_job_search_index.ts": jobSearchIndex,
  "20261201000007_job_search_trigrams.ts": jobSearchTrigrams,
  "20261201000008_job_totals.ts": jobTotals,
  "20261205000001_sign_in_devices.ts": signInDevices,
};

export const staticMigrationSource: Knex.MigrationSource<string> = {
  getMigrations: async () => Object.keys(MIGRATIONS).sort(),
  getMigrationName: (name) => name,
  getMigration: async (name) => {
    const migration = MIGRATIONS[name];
    if (!migration) throw new Error(`Unknown migration ${name}`);
    return migration;
  },
};
