/**
 * Query plans and timings of the list and search queries the app issues, on the large seeded
 * database (bench/seed-large.ts). The real data functions (lib/data/jobs.ts, inspections.ts,
 * sessions.ts, login-attempts.ts) are called and every SQL statement they send is captured from
 * Knex's query event, so the plans are of exactly what the app runs. Each statement goes through
 * EXPLAIN QUERY PLAN: a plain `SCAN` of a large table (no index at all) fails the goal; an index
 * search limited to the company (`SEARCH … USING INDEX (company_id=?)`) passes, but when the
 * search then reads every one of the company's rows (LIKE '%term%', which no b-tree index can
 * serve) the report says so.
 *
 * Run: NODE_OPTIONS=--conditions=react-server npx tsx bench/db-queries.bench.ts
 *      (the condition lets the `server-only` data modules load outside Next; npm run bench sets it)
 * Writes bench/results/db-queries.json. Goals: no full scan of a large table; every call < 20 ms median.
 */
import { performance } from "node:perf_hooks";
import Database from "better-sqlite3";
import { LARGE_DB_FILE, assertSeeded, machineLoad, median, quantile, round, writeResult } from "./support/common";

const RUNS = 30;
const LARGE_TABLES = new Set(["jobs", "inspections", "audit_events", "login_attempts", "sessions", "inspection_comments", "photos", "records"]);
const GOAL_MEDIAN_MS = 20;

type Captured = { sql: string; bindings: unknown[] };
type PlanKind = "search" | "index-scan" | "full-scan";

function classify(detail: string): { table: string; kind: PlanKind } | null {
  const m = /^(SEARCH|SCAN) (\S+)(?: AS \S+)?(.*)$/.exec(detail);
  if (!m) return null;
  const [, verb, alias, rest] = m;
  if (verb === "SEARCH") return { table: alias!, kind: "search" };
  return { table: alias!, kind: /USING (COVERING )?INDEX|USING INTEGER PRIMARY KEY/.test(rest!) ? "index-scan" : "full-scan" };
}

/** Maps the aliases a statement uses (`jobs as j`) back to table names. */
function aliasesOf(sql: string): Map<string, string> {
  const map = new Map<string, string>();
  for (const m of sql.matchAll(/`(\w+)` as `(\w+)`/g)) map.set(m[2]!, m[1]!);
  for (const m of sql.matchAll(/(?:from|join) `(\w+)`(?! as)/g)) map.set(m[1]!, m[1]!);
  return map;
}

async function main() {
  assertSeeded();
  const load = machineLoad();
  if (load.warning) console.warn(`WARNING: ${load.warning}`);
  process.env.FLUEWARD_DB_FILE = LARGE_DB_FILE;
  const { getDb } = await import("../db/knex");
  const jobs = await import("../lib/data/jobs");
  const inspections = await import("../lib/data/inspections");
  const sessions = await import("../lib/data/sessions");
  const attempts = await import("../lib/data/login-attempts");
  const { jobListQuerySchema } = await import("../lib/schemas/job");
  const { inspectionListQuerySchema } = await import("../lib/schemas/inspection");

  const raw = new Database(LARGE_DB_FILE, { readonly: true });
  const company = raw.prepare("select id from companies order by id limit 1").get() as { id: number };
  const installer = raw.prepare("select id from users where email = 'installer@flueward.test'").get() as { id: number };
  const someJob = raw.prepare("select job_id as id from inspections where company_id = ? group by job_id order by count(*) desc limit 1").get(company.id) as { id: number };
  const someInspection = raw.prepare("select id from inspections where company_id = ? and revision = 2 order by id desc limit 1").get(company.id) as { id: number };
  const counts = {
    jobs: (raw.prepare("select count(*) as n from jobs").get() as { n: number }).n,
    inspections: (raw.prepare("select count(*) as n from inspections").get() as { n: number }).n,
  };

  const db = getDb();
  let capture: Captured[] | null = null;
  // Knex's SQLite client binds booleans as 0/1; do the same for the plain driver.
  const toDriver = (v: unknown) => (typeof v === "boolean" ? Number(v) : v instanceof Date ? v.valueOf() : v);
  db.on("query", (q: { sql: string; bindings?: unknown[] }) => capture?.push({ sql: q.sql, bindings: (q.bindings ?? []).map(toDriver) }));

  const sid = "bench-session-id-0123456789abcdef0123456789";
  const cases: { name: string; call: () => Promise<unknown> }[] = [
    { name: "jobs: list, newest first (default)", call: () => jobs.listJobs({ companyId: company.id, userId: installer.id, query: jobListQuerySchema.parse({}) }) },
    { name: "jobs: list, page 200", call: () => jobs.listJobs({ companyId: company.id, userId: installer.id, query: jobListQuerySchema.parse({ page: "200" }) }) },
    { name: "jobs: status filter (completed)", call: () => jobs.listJobs({ companyId: company.id, userId: installer.id, query: jobListQuerySchema.parse({ status: "completed" }) }) },
    { name: "jobs: mine", call: () => jobs.listJobs({ companyId: company.id, userId: installer.id, query: jobListQuerySchema.parse({ mine: "1" }) }) },
    { name: "jobs: sort by customer", call: () => jobs.listJobs({ companyId: company.id, userId: installer.id, query: jobListQuerySchema.parse({ sort: "customer_asc" }) }) },
    { name: "jobs: search 'brook'", call: () => jobs.listJobs({ companyId: company.id, userId: installer.id, query: jobListQuerySchema.parse({ q: "brook" }) }) },
    { name: "jobs: search, one match (a reference)", call: () => jobs.listJobs({ companyId: company.id, userId: installer.id, query: jobListQuerySchema.parse({ q: "J-0042" }) }) },
    { name: "jobs: search, no match", call: () => jobs.listJobs({ companyId: company.id, userId: installer.id, query: jobListQuerySchema.parse({ q: "zzqx" }) }) },
    { name: "jobs: one job", call: () => jobs.getJobById({ companyId: company.id, id: someJob.id }) },
    { name: "inspections: review queue (submitted)", call: () => inspections.listInspections({ companyId: company.id, query: inspectionListQuerySchema.parse({}) }) },
    { name: "inspections: all, newest submission", call: () => inspections.listInspections({ companyId: company.id, query: inspectionListQuerySchema.parse({ status: "all", sort: "submitted_desc" }) }) },
    { name: "inspections: queue by customer", call: () => inspections.listInspections({ companyId: company.id, query: inspectionListQuerySchema.parse({ sort: "customer_asc" }) }) },
    { name: "inspections: search 'brook'", call: () => inspections.listInspections({ companyId: company.id, query: inspectionListQuerySchema.parse({ status: "all", q: "brook" }) }) },
    { name: "inspections: for one job", call: () => inspections.listInspectionsForJob({ companyId: company.id, jobId: someJob.id }) },
    { name: "inspections: one inspection (GET /api/inspections/:id)", call: () => inspections.getInspection({ companyId: company.id, id: someInspection.id }) },
    { name: "sessions: member behind a session", call: () => sessions.findSessionMember(sid) },
    { name: "sign-in: recent failures (rate limit)", call: () => attempts.recentFailures({ purpose: "sign_in", email: "installer@flueward.test", client: "127.0.0.1", device: null }, new Date(Date.now() - 900_000).toISOString()) },
    { name: "sign-in: recent failures of a known device", call: () => attempts.recentFailures({ purpose: "sign_in", email: "installer@flueward.test", client: "127.0.0.1", device: "AAAAAAAAAAAAAAAAAAAAAA" }, new Date(Date.now() - 900_000).toISOString()) },
  ];

  const results = [];
  for (const c of cases) {
    capture = [];
    await c.call();
    const statements = capture;
    capture = null;
    for (let i = 0; i < 3; i++) await c.call();
    const times: number[] = [];
    for (let i = 0; i < RUNS; i++) {
      const t0 = performance.now();
      await c.call();
      times.push(performance.now() - t0);
    }
    const plans = statements.map((s) => {
      const aliases = aliasesOf(s.sql);
      const rows = raw.prepare(`explain query plan ${s.sql}`).all(...(s.bindings as unknown[])) as { detail: string }[];
      const steps = rows.map((r) => r.detail);
      const touches = steps.map(classify).filter((x): x is NonNullable<typeof x> => x !== null).map((x) => ({ ...x, table: aliases.get(x.table) ?? x.table }));
      const fullScans = touches.filter((t) => t.kind === "full-scan" && LARGE_TABLES.has(t.table)).map((t) => t.table);
      const indexScans = touches.filter((t) => t.kind === "index-scan" && LARGE_TABLES.has(t.table)).map((t) => t.table);
      // Time the statement alone, through the driver, to separate SQLite from Knex and mapping.
      const stmt = raw.prepare(s.sql);
      const sqlTimes: number[] = [];
      for (let i = 0; i < RUNS; i++) {
        const t0 = performance.now();
        if (stmt.reader) stmt.all(...(s.bindings as unknown[]));
        sqlTimes.push(performance.now() - t0);
      }
      return {
        sql: s.sql,
        plan: steps,
        fullScans,
        indexScans,
        likeSearch: /like \?/i.test(s.sql),
        tempBtree: steps.some((d) => d.includes("TEMP B-TREE")),
        sqlMedianMs: round(median(sqlTimes), 3),
      };
    });
    const result = {
      name: c.name,
      statements: plans.length,
      medianMs: round(median(times), 3),
      p95Ms: round(quantile(times, 0.95), 3),
      fullScans: [...new Set(plans.flatMap((p) => p.fullScans))],
      indexScans: [...new Set(plans.flatMap((p) => p.indexScans))],
      plans,
    };
    results.push(result);
  }
  await db.destroy();
  raw.close();

  const fullScanCases = results.filter((r) => r.fullScans.length > 0).map((r) => r.name);
  const slowCases = results.filter((r) => r.medianMs >= GOAL_MEDIAN_MS).map((r) => r.name);
  const summary = {
    date: new Date().toISOString(),
    node: process.version,
    machine: load,
    database: { file: LARGE_DB_FILE, ...counts, analyzed: false },
    runsPerCase: RUNS,
    goals: { noFullScanOfLargeTable: fullScanCases.length === 0, medianUnderMs: GOAL_MEDIAN_MS, allUnder: slowCases.length === 0 },
    fullScanCases,
    slowCases,
    note: "LIKE '%term%' cannot use a b-tree index: searches are limited to the company's rows through an index, then test each of those rows (about 10,000 jobs here).",
    cases: results,
  };
  const written = writeResult("db-queries", summary);
  const pad = (s: string, n: number) => s.padEnd(n).slice(0, n);
  console.log(`database: ${counts.jobs} jobs, ${counts.inspections} inspections; median of ${RUNS} calls through lib/data (Knex or compiled reads, and mapping), plan of every statement`);
  for (const r of results) {
    const access = r.plans
      .map((p) => p.plan.filter((d) => /^(SEARCH|SCAN)/.test(d)).map((d) => d.replace(/ USING (COVERING )?INDEX /, " ~").replace(/\(.*\)/, (m) => m)).join(" + "))
      .join(" | ");
    const flag = r.fullScans.length ? "FULL SCAN" : r.plans.some((p) => p.likeSearch) ? "index+filter" : "index";
    console.log(`${pad(r.name, 56)} ${String(r.medianMs.toFixed(2)).padStart(7)} ms  ${pad(flag, 12)} ${access.slice(0, 150)}`);
  }
  console.log(`full scans of large tables: ${fullScanCases.length} (goal 0) ${fullScanCases.length ? "MISSED" : "OK"}; calls with median >= ${GOAL_MEDIAN_MS} ms: ${slowCases.length} ${slowCases.length ? "MISSED" : "OK"}`);
  console.log(`written ${written}`);
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
