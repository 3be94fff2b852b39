/**
 * Prints one table of every benchmark figure against its goal, from bench/results/*.json.
 * Run: npx tsx bench/summary.ts (npm run bench runs it last).
 */
import fs from "node:fs";
import path from "node:path";
import { RESULTS_DIR, SHARED_CORES_NOTE } from "./support/common";

type Json = Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any
const rows: [string, string, string, boolean | null][] = [];
const read = (name: string): Json | null => {
  const file = path.join(RESULTS_DIR, `${name}.json`);
  return fs.existsSync(file) ? (JSON.parse(fs.readFileSync(file, "utf8")) as Json) : null;
};

const seed = read("seed-large");
if (seed) rows.push(["seed: 10k jobs + 50k inspections", `${seed.seconds.total} s`, "< 60 s", seed.meetsGoal]);

const load = read("load");
if (load) {
  for (const e of load.endpoints) {
    for (const c of e.cells) {
      const share = e.jsonRead || !c.goals.shareOfCeiling ? `, ${Math.round(c.shareOfCeiling * 100)}% of ceiling` : "";
      const goal = `${e.jsonRead ? ">= 50% of ceiling, " : ""}p99 < ${load.goals.p99Ms[c.connections]} ms, 0 errors`;
      const errors = c.errors + c.timeouts + c.non2xx;
      rows.push([`load: ${e.name} @${c.connections}`, `${Math.round(c.requestsPerSecond)} req/s${share}, p50 ${c.latencyP50Ms} / p99 ${c.latencyP99Ms} ms, ${errors} errors`, goal, Object.values(c.goals).every(Boolean)]);
    }
  }
}

const attack = read("signin-attack");
if (attack) {
  const a = attack.underAttack;
  rows.push(["sign-in flood: GET /api/jobs during it", `${Math.round(a.requestsPerSecond)} req/s, p99 ${a.latencyP99Ms} ms (alone ${Math.round(attack.baseline.requestsPerSecond)} req/s)`, ">= 100 req/s, p99 < 300 ms", attack.met.apiRequestsPerSecond && attack.met.apiP99 && attack.met.apiNoErrors]);
  rows.push(["sign-in flood: answers", `${attack.flood.requests} sent: ${attack.flood.got429} × 429, ${attack.flood.got401} × 401`, "mostly 429, no 5xx", attack.met.floodMostly429 && attack.met.floodNo5xx]);
}

const queries = read("db-queries");
if (queries) {
  for (const c of queries.cases) rows.push([`db: ${c.name}`, `${c.medianMs} ms${c.fullScans.length ? `, FULL SCAN ${c.fullScans.join(", ")}` : ""}`, `no full scan, < ${queries.goals.medianUnderMs} ms`, c.fullScans.length === 0 && c.medianMs < queries.goals.medianUnderMs]);
}

const bundle = read("bundle-size");
if (bundle) for (const p of bundle.pages) rows.push([`first-load JS: ${p.route}`, `${p.firstLoadGzipKB} KB gzip`, `< ${p.goalKB} KB`, p.meetsGoal]);

const pdf = read("pdf");
if (pdf) {
  // Written by bench/pdf.bench.ts; its own fields, shown as they are.
  const median = pdf.medianMs ?? pdf.render?.medianMs ?? pdf.timing?.medianMs;
  const goal = pdf.goalMedianMs ?? pdf.goals?.medianMs ?? 100;
  const memory = pdf.peakRssMb !== undefined ? `, p95 ${pdf.p95Ms} ms, peak RSS ${pdf.peakRssMb} MB, heap ${pdf.peakHeapUsedMb} MB` : "";
  rows.push(["pdf: 30 segments, 8 photos", median !== undefined ? `median ${median} ms${memory}` : JSON.stringify(pdf).slice(0, 80), `median < ${goal} ms`, median !== undefined ? median < goal : null]);
}

const venting = read("venting");
if (venting) {
  rows.push(["engine: vent run", `median ${venting.ventRun.medianUs.toFixed(2)} µs`, "< 20 µs", venting.ventRun.meetsGoal]);
  rows.push(["engine: air space", `median ${venting.airSpace.medianUs.toFixed(2)} µs`, "< 5 µs", venting.airSpace.meetsGoal]);
}

const w = [Math.max(...rows.map((r) => r[0].length)), Math.max(...rows.map((r) => r[1].length)), Math.max(...rows.map((r) => r[2].length))];
console.log(`${"benchmark".padEnd(w[0]!)}  ${"measured".padEnd(w[1]!)}  ${"goal".padEnd(w[2]!)}  result`);
for (const [name, measured, goal, ok] of rows) console.log(`${name.padEnd(w[0]!)}  ${measured.padEnd(w[1]!)}  ${goal.padEnd(w[2]!)}  ${ok === null ? "-" : ok ? "met" : "MISSED"}`);
const missed = rows.filter((r) => r[3] === false).length;
console.log(`${rows.length} figures, ${missed} goals missed. ${SHARED_CORES_NOTE}`);
