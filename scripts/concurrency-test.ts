/**
 * Concurrency test: two production servers on ONE SQLite file. Two writers race on the same
 * inspection through different servers (a stale version must get 409, never a silent
 * overwrite), writers on their own inspections run in parallel across both servers, and one
 * submitted inspection is approved through both servers at once (exactly one 200).
 *
 *   npx next build && npx tsx scripts/concurrency-test.ts
 *
 * Bounded: about a minute of traffic, 2 minutes at most; exits 1 on a lost update, a 5xx, an
 * SQLITE_BUSY reaching a client, or a double approval that does not give exactly one success.
 */
import fs from "node:fs";
import path from "node:path";
import Database from "better-sqlite3";
import { AppServer, Client, DEMO, NoAnswer, exampleInspectionData, freePort, justificationsFor, prepareInstallation, signaturePng, tail, type Reply } from "./durability/harness";

const HARD_LIMIT_MS = 2 * 60_000;
const RACE_SAVES = Number(process.env.CONCURRENCY_RACE_SAVES ?? 60);
const RACE_ROUNDS = Number(process.env.CONCURRENCY_RACE_ROUNDS ?? 30);
const PARALLEL_SAVES = Number(process.env.CONCURRENCY_PARALLEL_SAVES ?? 25);
const PARALLEL_WRITERS = 6;
const DOUBLE_APPROVALS = 3;
const started = Date.now();
const servers: AppServer[] = [];

const watchdog = setTimeout(() => {
  console.error("concurrency test: hard time limit reached");
  for (const s of servers) if (s.child?.pid) process.kill(-s.child.pid, "SIGKILL");
  process.exit(1);
}, HARD_LIMIT_MS);
watchdog.unref();

let writes = 0;
let busyErrors = 0;
const problems: string[] = [];
const statusCounts = new Map<number, number>();

/** Every request goes through here: counts statuses, 5xx and any SQLITE_BUSY a client would see. */
async function call<T = Record<string, unknown>>(client: Client, server: AppServer, method: string, url: string, json?: unknown): Promise<Reply<T>> {
  let reply: Reply<T>;
  try {
    reply = await client.request<T>(method, url, { json, base: server.base, timeoutMs: 30_000 });
  } catch (error) {
    if (error instanceof NoAnswer) problems.push(`${method} ${url} on :${server.port}: no answer (${error.message})`);
    throw error;
  }
  statusCounts.set(reply.status, (statusCounts.get(reply.status) ?? 0) + 1);
  if (/SQLITE_BUSY|database is locked/i.test(reply.text)) busyErrors += 1;
  if (reply.status >= 500) problems.push(`${method} ${url} on :${server.port} → ${reply.status} ${reply.text.slice(0, 200)}`);
  return reply;
}

async function newInspection(client: Client, server: AppServer, label: string): Promise<number> {
  const job = await call<{ job: { id: number } }>(client, server, "POST", "/api/jobs", { customerName: `Concurrency ${label}`, siteStreet: "2 Ember Lane", siteCity: "Ambervale" });
  if (job.status !== 201) throw new Error(`job creation answered ${job.status}: ${job.text.slice(0, 200)}`);
  writes += 1;
  const inspection = await call<{ id: number }>(client, server, "POST", `/api/jobs/${job.body.job.id}/inspections`, {});
  if (inspection.status !== 201) throw new Error(`inspection creation answered ${inspection.status}: ${inspection.text.slice(0, 200)}`);
  writes += 1;
  return inspection.body.id;
}

type Save = { writer: string; base: number; version: number; marker: string };

/** Saves until `count` are acknowledged; on 409 re-reads the version (as the editor's reload does). */
async function saveLoop(client: Client, server: AppServer, id: number, writer: string, count: number, acked: Save[], counters: { conflicts: number }): Promise<void> {
  let version = 1;
  let seq = 0;
  for (let attempts = 0; acked.filter((s) => s.writer === writer).length < count && attempts < count * 6; attempts += 1) {
    seq += 1;
    const marker = `${writer}:${seq}`;
    const reply = await call<{ version: number }>(client, server, "PUT", `/api/inspections/${id}/draft`, { version, data: exampleInspectionData(marker) });
    if (reply.status === 200) {
      writes += 1;
      if (reply.body.version !== version + 1) problems.push(`${writer}: saved from version ${version} but got version ${reply.body.version}`);
      acked.push({ writer, base: version, version: reply.body.version, marker });
      version = reply.body.version;
    } else if (reply.status === 409) {
      counters.conflicts += 1;
      const current = await call<{ inspection: { version: number } }>(client, server, "GET", `/api/inspections/${id}`);
      if (current.status === 200) version = current.body.inspection.version;
    } else if (reply.status < 500) {
      problems.push(`${writer}: save answered ${reply.status} ${reply.text.slice(0, 200)}`);
      return;
    }
  }
}

/** Checks a chain of acknowledged saves on one inspection against the stored row. */
function lostUpdates(db: Database.Database, id: number, acked: Save[]): number {
  let lost = 0;
  const versions = acked.map((s) => s.version).sort((a, b) => a - b);
  // Two acknowledged saves that produced the same version: one silently overwrote the other.
  for (let i = 1; i < versions.length; i += 1) if (versions[i] === versions[i - 1]) lost += 1;
  const row = db.prepare("select version, data_json from inspections where id = ?").get(id) as { version: number; data_json: string } | undefined;
  if (!row) return lost + acked.length;
  const last = acked.reduce<Save | null>((best, s) => (!best || s.version > best.version ? s : best), null);
  if (last) {
    if (row.version !== last.version) lost += 1;
    if ((JSON.parse(row.data_json) as { notes: string }).notes !== last.marker) lost += 1;
  }
  return lost;
}

async function main(): Promise<number> {
  const installation = prepareInstallation("flueward-concurrency-");
  const portA = await freePort();
  const portB = await freePort(3400, 3499, [portA]);
  const a = new AppServer(portA, installation, path.join(installation.dir, "server-a.log"));
  const b = new AppServer(portB, installation, path.join(installation.dir, "server-b.log"));
  servers.push(a, b);
  await Promise.all([a.start(60_000), b.start(60_000)]);
  console.log(`[concurrency] one database ${installation.dbFile}, servers ${a.base} and ${b.base}`);

  const installer = new Client(a.base, DEMO.installer);
  const supervisor = new Client(a.base, DEMO.supervisor);
  await installer.signIn();
  await supervisor.signIn();
  const signature = await signaturePng();

  // 1. Two writers on one inspection, one through each server.
  const raceId = await newInspection(installer, a, "race");
  const race: Save[] = [];
  const raceCounters = { conflicts: 0 };
  const t1 = Date.now();
  await Promise.all([saveLoop(installer, a, raceId, "A", RACE_SAVES / 2, race, raceCounters), saveLoop(installer, b, raceId, "B", RACE_SAVES / 2, race, raceCounters)]);
  console.log(`[concurrency] same inspection: ${race.length} saves acknowledged, ${raceCounters.conflicts} stale saves refused with 409 (${Date.now() - t1} ms)`);

  // 1b. Rounds in which both writers save from the same version at the same moment: exactly one
  // may win each round, the other must get 409.
  const roundsId = await newInspection(installer, a, "rounds");
  const rounds: Save[] = [];
  let version = 1;
  let splitRounds = 0;
  for (let round = 1; round <= RACE_ROUNDS; round += 1) {
    const answers = await Promise.all(
      [a, b].map((server, i) => call<{ version: number }>(installer, server, "PUT", `/api/inspections/${roundsId}/draft`, { version, data: exampleInspectionData(`${"AB"[i]}:${round}`) })),
    );
    const wins = answers.map((r, i) => ({ r, writer: "AB"[i]! })).filter(({ r }) => r.status === 200);
    if (wins.length === 1 && answers.some((r) => r.status === 409)) splitRounds += 1;
    else problems.push(`round ${round}: answers ${answers.map((r) => r.status).join(", ")} (want one 200 and one 409)`);
    for (const { r, writer } of wins) {
      writes += 1;
      rounds.push({ writer, base: version, version: r.body.version, marker: `${writer}:${round}` });
    }
    if (wins[0]) version = wins[0].r.body.version;
  }
  console.log(`[concurrency] same version from both servers at once: ${splitRounds} of ${RACE_ROUNDS} rounds gave one 200 and one 409`);

  // 2. Writers on their own inspections, spread over both servers, plus new jobs on both.
  const own = await Promise.all(Array.from({ length: PARALLEL_WRITERS }, (_, i) => newInspection(installer, i % 2 ? b : a, `own ${i}`)));
  const ownSaves = own.map(() => [] as Save[]);
  const ownCounters = { conflicts: 0 };
  const t2 = Date.now();
  const jobWrites = async (server: AppServer, n: number) => {
    for (let i = 0; i < n; i += 1) {
      const reply = await call(supervisor, server, "POST", "/api/jobs", { customerName: `Parallel job ${server.port}-${i}`, siteStreet: "3 Ember Lane", siteCity: "Ambervale" });
      if (reply.status === 201) writes += 1;
    }
  };
  await Promise.all([
    ...own.map((id, i) => saveLoop(installer, i % 2 ? b : a, id, `own${i}`, PARALLEL_SAVES, ownSaves[i]!, ownCounters)),
    jobWrites(a, 15),
    jobWrites(b, 15),
  ]);
  if (ownCounters.conflicts) problems.push(`${ownCounters.conflicts} 409s for writers alone on their inspection`);
  console.log(`[concurrency] ${PARALLEL_WRITERS} inspections in parallel: ${ownSaves.flat().length} saves and 30 jobs (${Date.now() - t2} ms)`);

  // 3. A double approval of one submitted inspection, through both servers at once.
  const doubles: string[] = [];
  for (let i = 0; i < DOUBLE_APPROVALS; i += 1) {
    const id = await newInspection(installer, a, `double ${i}`);
    const first = await call<{ version: number; findings: never[] }>(installer, a, "PUT", `/api/inspections/${id}/draft`, { version: 1, data: exampleInspectionData("double") });
    const justified = { ...exampleInspectionData("double"), justifications: justificationsFor(first.body.findings) };
    const second = await call<{ version: number }>(installer, b, "PUT", `/api/inspections/${id}/draft`, { version: first.body.version, data: justified });
    const submitted = await call(installer, a, "POST", `/api/inspections/${id}/submit`, { version: second.body.version, signature: { typedName: "Tamsin Wexley", signaturePng: signature } });
    if (submitted.status !== 200) throw new Error(`submit answered ${submitted.status}: ${submitted.text.slice(0, 200)}`);
    writes += 3;
    const body = { password: DEMO.supervisor.password, signature: { typedName: "Arlo Brennick", signaturePng: signature } };
    const answers = await Promise.all([a, b].map((server) => call(supervisor, server, "POST", `/api/inspections/${id}/approve`, body)));
    const statuses = answers.map((r) => r.status).sort();
    doubles.push(statuses.join("+"));
    if (statuses.filter((s) => s === 200).length !== 1) problems.push(`double approval of ${id}: answers ${statuses.join(", ")} (want exactly one 200)`);
    else writes += 1;
  }
  console.log(`[concurrency] double approvals through both servers: ${doubles.join(", ")}`);

  await Promise.all(servers.map((s) => s.kill("SIGTERM")));
  for (const s of servers) s.close();
  const serverBusy = servers.reduce((n, s) => n + (fs.readFileSync(s.logFile, "utf8").match(/SQLITE_BUSY|database is locked/g)?.length ?? 0), 0);

  const db = new Database(installation.dbFile, { fileMustExist: true });
  let lost: number;
  let integrity: string;
  let recordsOk = true;
  try {
    integrity = (db.pragma("integrity_check") as { integrity_check: string }[]).map((r) => r.integrity_check).join("; ");
    lost = lostUpdates(db, raceId, race) + lostUpdates(db, roundsId, rounds) + own.reduce((n, id, i) => n + lostUpdates(db, id, ownSaves[i]!), 0);
    const perInspection = db.prepare("select inspection_id, count(*) as n from records group by inspection_id having n > 1").all();
    if (perInspection.length) recordsOk = false;
  } finally {
    db.close();
  }
  if (integrity !== "ok") problems.push(`integrity_check: ${integrity}`);
  if (!recordsOk) problems.push("an inspection has more than one record");
  if (serverBusy) problems.push(`${serverBusy} SQLITE_BUSY lines in the server logs`);

  const seconds = ((Date.now() - started) / 1000).toFixed(1);
  console.log(`[concurrency] ${seconds} s; answers by status: ${[...statusCounts].sort((x, y) => x[0] - y[0]).map(([s, n]) => `${s} ×${n}`).join(", ")}`);
  for (const p of problems.slice(0, 30)) console.error(`[concurrency] ${p}`);
  if (problems.some((p) => p.includes("→ 5"))) for (const s of servers) console.error(tail(s.logFile));
  console.log(`concurrency test: ${writes} writes, ${lost} lost updates, ${busyErrors} SQLITE_BUSY errors seen by clients`);
  const ok = lost === 0 && busyErrors === 0 && problems.length === 0;
  if (ok) fs.rmSync(installation.dir, { recursive: true, force: true });
  else console.log(`[concurrency] files kept in ${installation.dir}`);
  return ok ? 0 : 1;
}

main().then(
  (code) => process.exit(code),
  async (error: unknown) => {
    console.error(`concurrency test: failed to run: ${error instanceof Error ? error.stack : String(error)}`);
    await Promise.all(servers.map((s) => s.kill("SIGKILL")));
    process.exit(1);
  },
);
