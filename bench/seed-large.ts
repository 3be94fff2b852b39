/**
 * Seeds a large database for the load and query benchmarks: the demo data (both companies,
 * demo accounts, rulebooks, site checks, demo inspections) plus 10,000 jobs and 50,000
 * inspections for the first company (Kettlewick). Names, streets and towns are invented from
 * word lists; statuses are spread; every inspection holds data that passes the inspection schema,
 * findings computed by the engine and a summary that counts those findings.
 *
 * Run: npx tsx bench/seed-large.ts   (writes bench/results/large.sqlite and bench/results/seed-large.json)
 * FLUEWARD_BENCH_DB=/path/file.sqlite writes elsewhere. Goal: under 60 s.
 */
import fs from "node:fs";
import { performance } from "node:perf_hooks";
import Database from "better-sqlite3";
import knexFactory from "knex";
import sharp from "sharp";
import { buildKnexConfig } from "../db/config";
import { STARTER_RULEBOOK } from "../db/seeds/data/starter-rulebook";
import { DEFAULT_SITE_CHECK_ITEMS } from "../lib/site-checks/defaults";
import { prepareRulebook, type FindingSummary } from "../lib/venting";
import { inspectionDataSchema, type InspectionData } from "../lib/inspections/data";
import { evaluateInspectionData, type InspectionFinding } from "../lib/inspections/evaluate";
import { trigramsOf } from "../lib/search/trigrams";
import { LARGE_DB_FILE, round, writeResult } from "./support/common";

export const LARGE_JOBS = 10_000;
export const LARGE_INSPECTIONS = 50_000;
/** One inspection in this many keeps its full list of findings (about 20 kB); the rest keep only the non-passing ones, so the file stays near 150 MB. */
const FULL_FINDINGS_EVERY = 20;
const BATCH = 1_000;

// Deterministic, so every run seeds the same rows.
let state = 0x5eed_f1e;
const rand = () => {
  state = (state * 1664525 + 1013904223) >>> 0;
  return state / 2 ** 32;
};
const pick = <T>(xs: readonly T[]): T => xs[Math.floor(rand() * xs.length)]!;
const int = (lo: number, hi: number) => lo + Math.floor(rand() * (hi - lo + 1));

const GIVEN = ["Ada", "Bram", "Cora", "Dorian", "Elsie", "Fenn", "Greta", "Hollis", "Ines", "Jory", "Kit", "Lark", "Milo", "Nell", "Orrin", "Pippa", "Quinn", "Rowan", "Sable", "Tobin", "Una", "Vesper", "Wynn", "Yara", "Zeb", "Anselm", "Briony", "Calder", "Delphine", "Emrys"] as const;
const SURNAME_HEADS = ["Ash", "Bramble", "Cinder", "Dun", "Elder", "Fallow", "Gorse", "Hollin", "Ivy", "Juniper", "Kestrel", "Linden", "Moss", "Nettle", "Oak", "Pell", "Quill", "Rush", "Sorrel", "Thistle", "Umber", "Vetch", "Wren", "Yarrow"] as const;
const SURNAME_TAILS = ["brook", "combe", "field", "gate", "hurst", "ley", "mere", "ridge", "stow", "thwaite", "wick", "worth", "more", "dale", "by"] as const;
const STREET_WORDS = ["Lantern", "Millrace", "Tinder", "Kettle", "Copperleaf", "Gable", "Hearth", "Flint", "Chimney", "Bellows", "Saltmarsh", "Heron", "Cobble", "Larch", "Weaver", "Pennywhistle", "Draycott", "Ember", "Sparrow", "Foundry"] as const;
const STREET_KINDS = ["Lane", "Row", "Court", "Road", "Terrace", "Close", "Yard", "Rise", "Walk", "Mews"] as const;
const TOWNS = ["Ambervale", "Little Ambervale", "Briarmoot", "Cindergate", "Dunhallow", "Eskerby", "Fennick Cross", "Gildenford", "Harrowmere", "Ivelwick"] as const;
const JOB_STATUSES = ["scheduled", "scheduled", "in_progress", "awaiting_review", "completed", "completed", "completed", "cancelled"] as const;
const NOTES = ["", "", "Furnace replacement; keep the water heater on the common vent.", "Boiler swap in the basement; small room, check combustion air.", "Water heater replacement; connector passes the attic hatch.", "Quote visit for furnace and water heater; possible chimney liner."] as const;
const INSPECTION_STATUSES = ["draft", "submitted", "returned", "approved", "approved", "approved"] as const;

function summarise(findings: readonly InspectionFinding[]): FindingSummary {
  const counts = { pass: 0, warn: 0, "needs-info": 0, fail: 0 };
  for (const f of findings) counts[f.status as keyof typeof counts] += 1;
  const worst = counts.fail ? "fail" : counts["needs-info"] ? "needs-info" : counts.warn ? "warn" : "pass";
  return { total: findings.length, counts, worst } as FindingSummary;
}

/** About forty variants of the worked example: different inputs, slopes, lengths and rooms. */
function inspectionTemplates() {
  const example = JSON.parse(fs.readFileSync("docs/examples/check-request.json", "utf8"));
  const base = inspectionDataSchema.parse({ appliances: example.appliances, ventRun: example.ventRun, airSpace: example.airSpace, readings: example.readings });
  const rulebook = prepareRulebook(STARTER_RULEBOOK);
  const items = DEFAULT_SITE_CHECK_ITEMS;
  const templates: { dataJson: string; fullFindingsJson: string; fullSummaryJson: string; shortFindingsJson: string; shortSummaryJson: string }[] = [];
  for (let i = 0; i < 40; i++) {
    const data: InspectionData = structuredClone(base);
    data.appliances[0]!.inputBtuh = pick([40_000, 60_000, 80_000, 100_000, 120_000]);
    const seg = data.ventRun!.segments[1]!;
    seg.riseIn = pick([1, 1.5, 2, 2.5, 3]);
    seg.lengthFt = pick([4, 6, 8, 10]);
    seg.supportsInstalled = int(1, 3);
    data.ventRun!.vent.diameterIn = pick([4, 5, 6]);
    if (data.airSpace?.rooms[0]) data.airSpace.rooms[0].lengthFt = pick([10, 14, 18, 24]);
    if (rand() > 0.5) data.siteChecks = Object.fromEntries(items.map((item) => [item.key, { answer: "yes" as const, note: "" }]));
    data.notes = pick(NOTES);
    const parsed = inspectionDataSchema.parse(data);
    const evaluation = evaluateInspectionData(parsed, rulebook, items);
    const short = evaluation.findings.filter((f) => f.status !== "pass").slice(0, 3);
    templates.push({
      dataJson: JSON.stringify(parsed),
      fullFindingsJson: JSON.stringify(evaluation.findings),
      fullSummaryJson: JSON.stringify(evaluation.summary),
      shortFindingsJson: JSON.stringify(short),
      shortSummaryJson: JSON.stringify(summarise(short)),
    });
  }
  return templates;
}

async function signaturePng(): Promise<string> {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="200" height="60"><polyline points="10,40 40,20 70,45 100,15 130,40 160,25 190,35" fill="none" stroke="#1a2126" stroke-width="3"/></svg>`;
  return `data:image/png;base64,${(await sharp(Buffer.from(svg)).png().toBuffer()).toString("base64")}`;
}

async function main() {
  const t0 = performance.now();
  for (const suffix of ["", "-wal", "-shm"]) fs.rmSync(LARGE_DB_FILE + suffix, { force: true });

  // Schema and demo data exactly as the app seeds them.
  const knex = knexFactory(buildKnexConfig({ sqliteFile: LARGE_DB_FILE }));
  await knex.migrate.latest();
  await knex.seed.run();
  await knex.destroy();
  const tDemo = performance.now();

  const db = new Database(LARGE_DB_FILE);
  db.pragma("journal_mode = WAL");
  // Only while seeding: a crash here just means seeding again.
  db.pragma("synchronous = OFF");
  db.pragma("foreign_keys = ON");

  const company = db.prepare("select id from companies order by id limit 1").get() as { id: number };
  const members = db.prepare("select id, name, role from users where company_id = ? and active = 1 order by id").all(company.id) as { id: number; name: string; role: string }[];
  const installers = members.filter((m) => m.role === "installer");
  const reviewers = members.filter((m) => m.role !== "installer");
  const version = db
    .prepare("select rv.id from rulebook_versions rv join companies c on c.default_rulebook_id = rv.rulebook_id where c.id = ? order by rv.version_number desc limit 1")
    .get(company.id) as { id: number };
  const existingJobs = (db.prepare("select count(*) as n from jobs where company_id = ?").get(company.id) as { n: number }).n;
  const now = Date.now();
  const isoDaysAgo = (days: number) => new Date(now - days * 86_400_000).toISOString();

  const insertJob = db.prepare(`insert into jobs (company_id, reference, customer_name, customer_phone, customer_email, site_street, site_city, site_region, site_postal_code, status, assigned_installer_id, scheduled_for, notes, version, created_by, created_at, updated_at)
    values (@company_id, @reference, @customer_name, @customer_phone, @customer_email, @site_street, @site_city, '', @site_postal_code, @status, @assigned_installer_id, @scheduled_for, @notes, 1, @created_by, @created_at, @updated_at)`);
  // The search's trigram index, as createJob would write it (lib/data/job-search.ts).
  const insertTrigram = db.prepare("insert into job_search_trigrams (company_id, trigram, job_id) values (?, ?, ?)");
  const jobIds: number[] = [];
  const insertJobs = db.transaction((from: number, to: number) => {
    for (let n = from; n < to; n++) {
      const given = pick(GIVEN);
      const surname = `${pick(SURNAME_HEADS)}${pick(SURNAME_TAILS)}`;
      const customer = rand() < 0.15 ? `${given} and ${pick(GIVEN)} ${surname}` : `${given} ${surname}`;
      const createdDays = int(1, 720);
      const row = {
        company_id: company.id,
        reference: `J-${String(existingJobs + n + 1).padStart(4, "0")}`,
        customer_name: customer,
        customer_phone: rand() < 0.7 ? `555-01${String(int(0, 99)).padStart(2, "0")}` : "",
        customer_email: rand() < 0.5 ? `${given}.${surname}@homeowner.test`.toLowerCase() : "",
        site_street: `${int(1, 240)} ${pick(STREET_WORDS)} ${pick(STREET_KINDS)}`,
        site_city: pick(TOWNS),
        site_postal_code: `AV${int(1, 9)} ${int(1, 9)}${String.fromCharCode(65 + int(0, 25))}${String.fromCharCode(65 + int(0, 25))}`,
        status: pick(JOB_STATUSES),
        assigned_installer_id: rand() < 0.85 ? pick(installers).id : null,
        scheduled_for: rand() < 0.9 ? isoDaysAgo(createdDays - int(0, 30)).slice(0, 10) : null,
        notes: pick(NOTES),
        created_by: pick(members).id,
        created_at: isoDaysAgo(createdDays),
        updated_at: isoDaysAgo(Math.max(0, createdDays - int(0, 40))),
      };
      const jobId = Number(insertJob.run(row).lastInsertRowid);
      for (const trigram of trigramsOf([row.customer_name, row.site_street, row.site_city, row.reference])) insertTrigram.run(company.id, trigram, jobId);
      jobIds.push(jobId);
    }
  });
  for (let from = 0; from < LARGE_JOBS; from += BATCH) insertJobs(from, Math.min(LARGE_JOBS, from + BATCH));
  // The company's job total, as createJob keeps it (lib/data/job-totals.ts).
  db.prepare("delete from job_totals where company_id = ?").run(company.id);
  db.prepare("insert into job_totals (company_id, job_count, last_job_id) select company_id, count(*), max(id) from jobs where company_id = ? group by company_id").run(company.id);
  const tJobs = performance.now();

  const templates = inspectionTemplates();
  const signature = await signaturePng();
  let nextId = ((db.prepare("select max(id) as m from inspections").get() as { m: number | null }).m ?? 0) + 1;
  const insertInspection = db.prepare(`insert into inspections (id, company_id, job_id, status, revision, root_inspection_id, previous_inspection_id, rulebook_version_id, data_json, findings_json, summary_json, version, created_by, installer_id, installer_signed_name, installer_signature_png, submitted_at, approved_by, supervisor_signed_name, supervisor_signature_png, approved_at, superseded_at, created_at, updated_at)
    values (@id, @company_id, @job_id, @status, @revision, @root_inspection_id, @previous_inspection_id, @rulebook_version_id, @data_json, @findings_json, @summary_json, @version, @created_by, @installer_id, @installer_signed_name, @installer_signature_png, @submitted_at, @approved_by, @supervisor_signed_name, @supervisor_signature_png, @approved_at, @superseded_at, @created_at, @updated_at)`);
  let inserted = 0;
  let revisions = 0;
  const insertInspections = db.transaction((count: number) => {
    for (let k = 0; k < count; k++) {
      const jobId = jobIds[(inserted + k) % jobIds.length]!;
      const installer = pick(installers);
      const reviewer = pick(reviewers);
      const template = pick(templates);
      const full = (nextId % FULL_FINDINGS_EVERY) === 0;
      const status = pick(INSPECTION_STATUSES);
      const days = int(0, 700);
      const when = isoDaysAgo(days);
      const signed = status !== "draft";
      const approved = status === "approved";
      // One approved inspection in ten was corrected once: revision 2 supersedes revision 1.
      const corrected = approved && rand() < 0.1 && k + 1 < count;
      const row = (id: number, revision: number, rowStatus: string, root: number, previous: number | null, superseded: string | null) => ({
        id,
        company_id: company.id,
        job_id: jobId,
        status: rowStatus,
        revision,
        root_inspection_id: root,
        previous_inspection_id: previous,
        rulebook_version_id: version.id,
        data_json: template.dataJson,
        findings_json: full ? template.fullFindingsJson : template.shortFindingsJson,
        summary_json: full ? template.fullSummaryJson : template.shortSummaryJson,
        version: int(1, 12),
        created_by: installer.id,
        installer_id: installer.id,
        installer_signed_name: signed ? installer.name : null,
        installer_signature_png: signed ? signature : null,
        submitted_at: signed ? when : null,
        approved_by: rowStatus === "approved" ? reviewer.id : null,
        supervisor_signed_name: rowStatus === "approved" ? reviewer.name : null,
        supervisor_signature_png: rowStatus === "approved" ? signature : null,
        approved_at: rowStatus === "approved" ? when : null,
        superseded_at: superseded,
        created_at: when,
        updated_at: when,
      });
      const id = nextId++;
      if (corrected) {
        insertInspection.run(row(id, 1, "approved", id, null, when));
        insertInspection.run(row(nextId++, 2, "approved", id, id, null));
        revisions++;
        k++;
      } else {
        insertInspection.run(row(id, 1, status, id, null, null));
      }
    }
    inserted += count;
  });
  for (let from = 0; from < LARGE_INSPECTIONS; from += BATCH) insertInspections(Math.min(BATCH, LARGE_INSPECTIONS - from));
  const tInspections = performance.now();
  db.pragma("wal_checkpoint(TRUNCATE)");

  const counts = {
    jobs: (db.prepare("select count(*) as n from jobs where company_id = ?").get(company.id) as { n: number }).n,
    inspections: (db.prepare("select count(*) as n from inspections where company_id = ?").get(company.id) as { n: number }).n,
    inspectionsByStatus: Object.fromEntries((db.prepare("select status, count(*) as n from inspections where company_id = ? group by status").all(company.id) as { status: string; n: number }[]).map((r) => [r.status, r.n])),
    jobsByStatus: Object.fromEntries((db.prepare("select status, count(*) as n from jobs where company_id = ? group by status").all(company.id) as { status: string; n: number }[]).map((r) => [r.status, r.n])),
    correctedRevisions: revisions,
  };
  const integrity = db.pragma("quick_check", { simple: true });
  db.close();
  const sizeMb = fs.statSync(LARGE_DB_FILE).size / 1024 / 1024;
  const seconds = (performance.now() - t0) / 1000;
  const result = {
    date: new Date().toISOString(),
    node: process.version,
    file: LARGE_DB_FILE,
    companyId: company.id,
    counts,
    sizeMb: round(sizeMb),
    integrity,
    seconds: { total: round(seconds, 2), demo: round((tDemo - t0) / 1000, 2), jobs: round((tJobs - tDemo) / 1000, 2), inspections: round((tInspections - tJobs) / 1000, 2) },
    goalSeconds: 60,
    meetsGoal: seconds < 60,
  };
  const written = writeResult("seed-large", result);
  console.log(
    `seeded ${counts.jobs} jobs and ${counts.inspections} inspections for company ${company.id} in ${result.seconds.total} s (goal < 60 s) ${result.meetsGoal ? "OK" : "MISSED"}; ${result.sizeMb} MB, quick_check ${integrity}`,
  );
  console.log(`database ${LARGE_DB_FILE}; written ${written}`);
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
