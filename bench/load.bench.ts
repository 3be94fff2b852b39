/**
 * Load benchmark of the production build on loopback, on the large seeded database
 * (bench/seed-large.ts: 10,000 jobs and 50,000 inspections).
 *
 * Endpoints: a constant route handler (/api/bench/ping, the ceiling), the jobs list API with and
 * without a search term, one inspection's JSON, POST /api/check with the worked example, and the
 * sign-in page; each at 10 and 50 connections for a bounded time (BENCH_DURATION_S, default 10).
 * Goals: authenticated JSON reads at least 50 % of the ceiling's requests per second; p99 under
 * 100 ms at 10 connections and under 400 ms at 50; no errors and no non-2xx answers.
 *
 * Each cell opens its connections, loads them for WARMUP_S seconds unmeasured, then measures
 * DURATION_S seconds on the same connections (steady state). The first answer on each new
 * connection is reported beside it: when 50 connections open at once against a busy server,
 * Node takes them in one per turn of its event loop, so those first answers wait longest.
 *
 * Run after `npx next build`: npx tsx bench/load.bench.ts   (writes bench/results/load.json)
 */
import fs from "node:fs";
import Database from "better-sqlite3";
import { LARGE_DB_FILE, SHARED_CORES_NOTE, assertBuilt, assertSeeded, freePort, machineLoad, round, scratchCopy, signIn, startServer, writeResult } from "./support/common";
import { runSteady, type SteadyCell } from "./support/load";

const DURATION_S = Number(process.env.BENCH_DURATION_S ?? 10);
/** Seconds of load on the same connections before the measured window opens. */
const WARMUP_S = 3;
const CONNECTIONS = [10, 50] as const;
const GOAL_SHARE = 0.5;
const GOAL_P99_MS: Record<number, number> = { 10: 100, 50: 400 };
export const SEARCH_TERM = "brook";

interface Endpoint {
  name: string;
  method: "GET" | "POST";
  path: string;
  authenticated: boolean;
  /** An authenticated JSON read: held to the share-of-ceiling goal. */
  jsonRead: boolean;
  body?: string;
  ceiling?: boolean;
}

async function main() {
  assertBuilt();
  assertSeeded();
  const dbFile = scratchCopy(LARGE_DB_FILE, "load-run");
  const raw = new Database(dbFile, { readonly: true });
  // A full-sized inspection (complete data and findings), the kind the editor opens.
  const inspection = raw.prepare("select id, length(data_json) + length(findings_json) as bytes from inspections where company_id = 1 and id % 20 = 0 order by id desc limit 1").get() as { id: number; bytes: number };
  raw.close();
  const checkBody = fs.readFileSync("docs/examples/check-request.json", "utf8");

  const endpoints: Endpoint[] = [
    { name: "ceiling: constant handler", method: "GET", path: "/api/bench/ping", authenticated: false, jsonRead: false, ceiling: true },
    { name: "GET /api/jobs", method: "GET", path: "/api/jobs", authenticated: true, jsonRead: true },
    { name: `GET /api/jobs?q=${SEARCH_TERM}`, method: "GET", path: `/api/jobs?q=${SEARCH_TERM}`, authenticated: true, jsonRead: true },
    { name: "GET /api/inspections/:id", method: "GET", path: `/api/inspections/${inspection.id}`, authenticated: true, jsonRead: true },
    { name: "POST /api/check", method: "POST", path: "/api/check", authenticated: true, jsonRead: false, body: checkBody },
    { name: "GET /sign-in (page)", method: "GET", path: "/sign-in", authenticated: false, jsonRead: false },
  ];

  const load = machineLoad();
  if (load.warning) console.warn(`WARNING: ${load.warning}`);
  const port = await freePort(3510);
  const server = await startServer({ port, dbFile });
  const results: { endpoint: Endpoint; cells: (SteadyCell & { shareOfCeiling: number; goals: Record<string, boolean> })[]; sample: string }[] = [];
  try {
    const cookie = await signIn(server.base);
    const headersFor = (e: Endpoint): Record<string, string> => ({
      ...(e.authenticated ? { cookie } : {}),
      ...(e.body ? { "content-type": "application/json", origin: server.base } : {}),
    });
    // Every endpoint answers correctly once before it is loaded.
    for (const e of endpoints) {
      const response = await fetch(server.base + e.path, { method: e.method, headers: headersFor(e), body: e.body, redirect: "manual" });
      const text = await response.text();
      if (response.status !== 200) throw new Error(`${e.name} answered ${response.status}: ${text.slice(0, 300)}`);
      results.push({ endpoint: e, cells: [], sample: `${response.status}, ${text.length} bytes` });
    }
    const ceilingByConnections = new Map<number, number>();
    for (const connections of CONNECTIONS) {
      for (const entry of results) {
        const e = entry.endpoint;
        const options = { url: server.base + e.path, method: e.method, headers: headersFor(e), body: e.body, connections };
        const cell = await runSteady({ ...options, warmupS: WARMUP_S, duration: DURATION_S });
        if (e.ceiling) ceilingByConnections.set(connections, cell.requestsPerSecond);
        const ceiling = ceilingByConnections.get(connections) ?? Number.NaN;
        const shareOfCeiling = round(cell.requestsPerSecond / ceiling, 3);
        const goals: Record<string, boolean> = {
          p99: cell.latencyP99Ms < GOAL_P99_MS[connections]!,
          noErrors: cell.errors === 0 && cell.timeouts === 0 && cell.non2xx === 0,
        };
        if (e.jsonRead) goals.shareOfCeiling = shareOfCeiling >= GOAL_SHARE;
        entry.cells.push({ ...cell, shareOfCeiling, goals });
        process.stdout.write(`  ${e.name} @${connections}: ${cell.requestsPerSecond} req/s, p99 ${cell.latencyP99Ms} ms (first answer on a new connection: max ${cell.firstResponseOnNewConnection.maxMs} ms)\n`);
      }
    }
  } finally {
    await server.stop();
  }

  const allMet = results.every((r) => r.cells.every((c) => Object.values(c.goals).every(Boolean)));
  const summary = {
    date: new Date().toISOString(),
    node: process.version,
    machine: { ...load, memoryGiB: round((await import("node:os")).totalmem() / 2 ** 30, 1) },
    note: SHARED_CORES_NOTE,
    database: { jobs: 10_000, inspections: 50_000, fetchedInspectionId: inspection.id, fetchedInspectionJsonBytes: inspection.bytes },
    durationS: DURATION_S,
    warmupS: WARMUP_S,
    goals: { jsonReadShareOfCeiling: GOAL_SHARE, p99Ms: GOAL_P99_MS, errors: 0 },
    allGoalsMet: allMet,
    endpoints: results.map((r) => ({ name: r.endpoint.name, path: r.endpoint.path, method: r.endpoint.method, jsonRead: r.endpoint.jsonRead, sample: r.sample, cells: r.cells })),
  };
  const written = writeResult("load", summary);
  console.log(`\n${SHARED_CORES_NOTE}`);
  if (load.warning) console.log(`WARNING: ${load.warning}`);
  console.log(`${"endpoint".padEnd(30)} conns   req/s  share   p50 ms   p99 ms  errors/non-2xx  goals`);
  for (const r of results) {
    for (const c of r.cells) {
      const failed = Object.entries(c.goals).filter(([, ok]) => !ok).map(([k]) => k);
      console.log(
        `${r.endpoint.name.padEnd(30)} ${String(c.connections).padStart(5)} ${c.requestsPerSecond.toFixed(0).padStart(7)} ${`${Math.round(c.shareOfCeiling * 100)}%`.padStart(6)} ${String(c.latencyP50Ms).padStart(8)} ${String(c.latencyP99Ms).padStart(8)} ${`${c.errors + c.timeouts}/${c.non2xx}`.padStart(15)}  ${failed.length ? `MISSED ${failed.join(", ")}` : "OK"}`,
      );
    }
  }
  console.log(`goals: JSON reads >= ${GOAL_SHARE * 100}% of ceiling, p99 < 100 ms @10 and < 400 ms @50, no errors — ${allMet ? "all met" : "some MISSED"}`);
  console.log(`written ${written}`);
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
