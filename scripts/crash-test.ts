/**
 * Crash test: runs writes through the HTTP API of the production server (draft autosaves, photo
 * uploads, new jobs and inspections, submit + approve with its record PDF) while killing the
 * server with SIGKILL at random moments, restarting it each time. Then, with the server dead, it
 * opens the database file and checks that every acknowledged write is there and intact, that
 * integrity_check is ok and that no photo or record row points at a missing or partial file.
 *
 *   npx next build && npx tsx scripts/crash-test.ts        (CRASH_KILLS=50 by default)
 *
 * Bounded: stops killing after CRASH_KILLS kills or 300 s, whichever comes first; exits 1 on
 * any loss, corruption, server error or too few kills.
 */
import fs from "node:fs";
import path from "node:path";
import Database from "better-sqlite3";
import { checkBlobReferences } from "../lib/ops/backup";
import { AppServer, Client, DEMO, NoAnswer, exampleInspectionData, freePort, justificationsFor, prepareInstallation, randomInt, sha256, signaturePng, sleep, tail, type Reply } from "./durability/harness";

const MIN_KILLS = Number(process.env.CRASH_KILLS ?? 50);
const LOOP_BUDGET_MS = Number(process.env.CRASH_BUDGET_MS ?? 300_000);
const HARD_LIMIT_MS = 7 * 60_000;
const WRITERS = 3;
const started = Date.now();

// A watchdog: whatever happens, the script ends (and takes its server with it) within 7 minutes.
let server: AppServer | null = null;
const watchdog = setTimeout(() => {
  console.error("crash test: hard time limit reached");
  if (server?.child?.pid) {
    try {
      process.kill(-server.child.pid, "SIGKILL");
    } catch {
      /* gone */
    }
  }
  process.exit(1);
}, HARD_LIMIT_MS);
watchdog.unref();

/* ---------- what the API acknowledged ---------- */

const acked = {
  drafts: new Map<number, { version: number; seq: number }>(),
  photos: new Map<number, { sha256: string; bytes: number; inspectionId: number }>(),
  jobs: new Map<number, string>(),
  inspections: new Set<number>(),
  approvals: new Map<number, { recordId?: number; sha256?: string }>(),
};
let ackCount = 0;
const serverErrors: string[] = [];
const counts = { attempted: 0, noAnswer: 0, conflicts: 0 };
/** Answers other than 2xx, by method, route shape and status (e.g. "PUT /api/inspections/:id/draft 409"). */
const refusals = new Map<string, number>();

function ack(): void {
  ackCount += 1;
}

/* ---------- server lifecycle shared by the writers ---------- */

let up = false;
let waiters: (() => void)[] = [];
function setUp(value: boolean): void {
  up = value;
  if (value) {
    for (const w of waiters) w();
    waiters = [];
  }
}
const whenUp = () => (up ? Promise.resolve() : new Promise<void>((resolve) => waiters.push(resolve)));
let stopping = false;

/** Sends a request; on no answer waits for the next server and reports null (not acknowledged). */
async function send<T = Record<string, unknown>>(client: Client, method: string, url: string, options: { json?: unknown; form?: FormData } = {}): Promise<Reply<T> | null> {
  counts.attempted += 1;
  try {
    const reply = await client.request<T>(method, url, options);
    if (reply.status >= 300) {
      const key = `${method} ${url.replace(/\/\d+/g, "/:id")} ${reply.status}`;
      refusals.set(key, (refusals.get(key) ?? 0) + 1);
    }
    if (reply.status >= 500) serverErrors.push(`${method} ${url} → ${reply.status} ${reply.text.slice(0, 200)}`);
    if (reply.status === 401) await client.signIn().catch(() => undefined);
    return reply;
  } catch (error) {
    if (!(error instanceof NoAnswer)) throw error;
    counts.noAnswer += 1;
    if (!stopping) await whenUp();
    return null;
  }
}

/* ---------- the writes ---------- */

const photoBytes = fs.readFileSync(path.join(process.cwd(), "tests/fixtures/photos/flue-collar.jpg"));
let jobSeq = 0;

async function createJob(client: Client, tag: string): Promise<number | null> {
  jobSeq += 1;
  const customerName = `Crash ${tag} ${jobSeq} ${Date.now().toString(36)}`;
  const reply = await send<{ job: { id: number } }>(client, "POST", "/api/jobs", { json: { customerName, siteStreet: "1 Ember Lane", siteCity: "Ambervale" } });
  if (reply?.status !== 201) return null;
  acked.jobs.set(reply.body.job.id, customerName);
  ack();
  return reply.body.job.id;
}

async function createInspection(client: Client, jobId: number): Promise<{ id: number; version: number } | null> {
  const reply = await send<{ id: number }>(client, "POST", `/api/jobs/${jobId}/inspections`, { json: {} });
  if (reply?.status !== 201) return null;
  acked.inspections.add(reply.body.id);
  ack();
  return { id: reply.body.id, version: 1 };
}

/** Re-reads an inspection's version after an unacknowledged or conflicting save. */
async function currentVersion(client: Client, id: number): Promise<number | null> {
  for (let i = 0; i < 5 && !stopping; i += 1) {
    const reply = await send<{ inspection: { version: number } }>(client, "GET", `/api/inspections/${id}`);
    if (reply?.status === 200) return reply.body.inspection.version;
  }
  return null;
}

const seqs = new Map<number, number>();
async function saveDraft(client: Client, draft: { id: number; version: number }, data?: Record<string, unknown>): Promise<Reply<{ version: number; findings: never[] }> | null> {
  const seq = (seqs.get(draft.id) ?? 0) + 1;
  seqs.set(draft.id, seq);
  const body = { ...(data ?? exampleInspectionData()), notes: `marker ${draft.id}:${seq}` };
  const reply = await send<{ version: number; findings: never[] }>(client, "PUT", `/api/inspections/${draft.id}/draft`, { json: { version: draft.version, data: body } });
  if (reply?.status === 200) {
    draft.version = reply.body.version;
    acked.drafts.set(draft.id, { version: reply.body.version, seq });
    ack();
    return reply;
  }
  if (reply?.status === 409) counts.conflicts += 1;
  // Unacknowledged (or a stale version after one): it may or may not have landed; resync.
  const version = await currentVersion(client, draft.id);
  if (version !== null) draft.version = version;
  return null;
}

async function uploadPhoto(client: Client, inspectionId: number): Promise<boolean> {
  const form = new FormData();
  form.set("file", new Blob([photoBytes], { type: "image/jpeg" }), "flue-collar.jpg");
  form.set("caption", `crash photo ${Date.now().toString(36)}`);
  const reply = await send<{ photo: { id: number; sha256: string; bytes: number } }>(client, "POST", `/api/inspections/${inspectionId}/photos`, { form });
  if (reply?.status !== 201) return false;
  acked.photos.set(reply.body.photo.id, { sha256: reply.body.photo.sha256, bytes: reply.body.photo.bytes, inspectionId });
  ack();
  return true;
}

/** One installer's autosaves, photos and new jobs on inspections of its own. */
async function writer(index: number, client: Client, deadline: () => boolean): Promise<void> {
  const drafts: { id: number; version: number }[] = [];
  while (!deadline()) {
    const roll = Math.random();
    if (drafts.length === 0 || (roll < 0.12 && drafts.length < 4)) {
      const jobId = await createJob(client, `w${index}`);
      if (jobId === null) continue;
      const inspection = await createInspection(client, jobId);
      if (inspection) drafts.push(inspection);
    } else if (roll < 0.22) {
      await createJob(client, `w${index}`);
    } else if (roll < 0.4) {
      await uploadPhoto(client, drafts[randomInt(0, drafts.length - 1)]!.id);
    } else {
      await saveDraft(client, drafts[randomInt(0, drafts.length - 1)]!);
    }
  }
}

/**
 * Whole approvals: a new inspection, a photo, a justified draft, submit, approve, read the record.
 * A step cut off by a kill is retried on the next server after re-reading the inspection's state.
 */
async function approver(installer: Client, supervisor: Client, signature: string, deadline: () => boolean): Promise<void> {
  let draft: { id: number; version: number } | null = null;
  let photoDone = false;
  let justified: Record<string, unknown> | null = null;
  let justifiedSaved = false;
  const next = () => {
    draft = null;
    photoDone = false;
    justified = null;
    justifiedSaved = false;
  };
  while (!deadline()) {
    if (!draft) {
      const jobId = await createJob(installer, "approval");
      if (jobId !== null) draft = await createInspection(installer, jobId);
      continue;
    }
    const d: { id: number; version: number } = draft;
    if (!photoDone) {
      photoDone = await uploadPhoto(installer, d.id);
      continue;
    }
    if (!justified) {
      const first = await saveDraft(installer, d);
      if (first) justified = { ...exampleInspectionData(), justifications: justificationsFor(first.body.findings) };
      continue;
    }
    const state = await send<{ inspection: { version: number; status: string } }>(installer, "GET", `/api/inspections/${d.id}`);
    if (state?.status !== 200) continue;
    const { status, version } = state.body.inspection;
    d.version = version;
    if (status === "draft") {
      if (!justifiedSaved) {
        justifiedSaved = Boolean(await saveDraft(installer, d, justified));
        continue;
      }
      const submitted = await send<{ inspection: { version: number } }>(installer, "POST", `/api/inspections/${d.id}/submit`, {
        json: { version: d.version, signature: { typedName: "Tamsin Wexley", signaturePng: signature } },
      });
      if (submitted?.status === 200) {
        ack(); // checked as the inspection's version moving past the last save
        acked.drafts.set(d.id, { version: submitted.body.inspection.version, seq: seqs.get(d.id) ?? 0 });
      } else if (submitted && submitted.status !== 409) next();
    } else if (status === "submitted") {
      const approved = await send(supervisor, "POST", `/api/inspections/${d.id}/approve`, {
        json: { password: DEMO.supervisor.password, signature: { typedName: "Arlo Brennick", signaturePng: signature } },
      });
      if (approved?.status === 200) {
        acked.approvals.set(d.id, {});
        ack();
        await fetchRecord(supervisor, d.id);
        next();
      } else if (approved && approved.status !== 409) next();
    } else {
      // Approved by a request whose answer a kill cut off: allowed to exist, not counted.
      next();
    }
  }
}

async function fetchRecord(client: Client, inspectionId: number): Promise<void> {
  for (let i = 0; i < 5; i += 1) {
    const reply = await send<{ records: { id: number; inspectionId: number; sha256: string }[] }>(client, "GET", `/api/inspections/${inspectionId}/record`);
    if (reply?.status === 200) {
      const record = reply.body.records.find((r) => r.inspectionId === inspectionId);
      acked.approvals.set(inspectionId, { recordId: record?.id ?? -1, sha256: record?.sha256 ?? "missing" });
      return;
    }
    if (stopping) return;
  }
}

/* ---------- the check, on the dead server's files ---------- */

function verify(dbFile: string, uploadsDir: string): { lost: string[]; corrupt: string[]; integrity: string; tempFiles: number } {
  const lost: string[] = [];
  const corrupt: string[] = [];
  const db = new Database(dbFile, { fileMustExist: true });
  try {
    const integrity = (db.pragma("integrity_check") as { integrity_check: string }[]).map((r) => r.integrity_check).join("; ");
    const fk = db.pragma("foreign_key_check") as unknown[];
    if (fk.length) corrupt.push(`${fk.length} foreign key violations`);

    const inspection = db.prepare("select id, version, status, data_json, findings_json, summary_json from inspections where id = ?");
    for (const id of acked.inspections) if (!inspection.get(id)) lost.push(`inspection ${id} (created) is missing`);
    for (const [id, want] of acked.drafts) {
      const row = inspection.get(id) as { version: number; data_json: string } | undefined;
      if (!row) {
        lost.push(`inspection ${id} is missing`);
        continue;
      }
      const notes = String((JSON.parse(row.data_json) as { notes?: string }).notes ?? "");
      const match = /^marker (\d+):(\d+)$/.exec(notes);
      const seq = match && Number(match[1]) === id ? Number(match[2]) : 0;
      if (row.version < want.version) lost.push(`inspection ${id}: version ${row.version} < acknowledged ${want.version}`);
      if (seq < want.seq) lost.push(`inspection ${id}: draft holds save ${seq}, acknowledged save ${want.seq}`);
    }
    const job = db.prepare("select customer_name from jobs where id = ?");
    for (const [id, name] of acked.jobs) {
      const row = job.get(id) as { customer_name: string } | undefined;
      if (!row || row.customer_name !== name) lost.push(`job ${id} (${name}) is missing or changed`);
    }
    const photo = db.prepare("select sha256, bytes, inspection_id, deleted_at from photos where id = ?");
    for (const [id, want] of acked.photos) {
      const row = photo.get(id) as { sha256: string; bytes: number; inspection_id: number; deleted_at: string | null } | undefined;
      if (!row || row.sha256 !== want.sha256 || row.bytes !== want.bytes || row.inspection_id !== want.inspectionId || row.deleted_at) lost.push(`photo ${id} is missing or changed`);
    }
    const record = db.prepare("select r.id, r.sha256, i.status from records r join inspections i on i.id = r.inspection_id where r.inspection_id = ?");
    for (const [inspectionId, want] of acked.approvals) {
      const row = record.get(inspectionId) as { id: number; sha256: string; status: string } | undefined;
      if (!row) lost.push(`approval of inspection ${inspectionId}: no record row`);
      else if (row.status !== "approved") lost.push(`approval of inspection ${inspectionId}: status is ${row.status}`);
      else if (want.recordId !== undefined && (want.recordId !== row.id || want.sha256 !== row.sha256)) lost.push(`record of inspection ${inspectionId}: the API said ${want.recordId}/${want.sha256}, the database has ${row.id}/${row.sha256}`);
    }

    // Whatever landed, acknowledged or not, is whole.
    for (const row of db.prepare("select id, data_json, findings_json, summary_json from inspections").iterate() as Iterable<Record<string, string>>) {
      for (const column of ["data_json", "findings_json", "summary_json"]) {
        try {
          JSON.parse(row[column]!);
        } catch {
          corrupt.push(`inspection ${row.id}: ${column} is not JSON`);
        }
      }
    }
    const orphanApprovals = db.prepare("select i.id from inspections i left join records r on r.inspection_id = i.id where i.status = 'approved' and i.approved_at >= ? and r.id is null").all(new Date(started).toISOString()) as { id: number }[];
    for (const o of orphanApprovals) corrupt.push(`inspection ${o.id} is approved without a record`);
    const blobs = checkBlobReferences(db, uploadsDir);
    corrupt.push(...blobs.problems);

    let tempFiles = 0;
    if (fs.existsSync(uploadsDir)) for (const entry of fs.readdirSync(uploadsDir, { recursive: true, withFileTypes: true })) if (entry.isFile() && entry.name.startsWith(".tmp-")) tempFiles += 1;
    return { lost, corrupt, integrity, tempFiles };
  } finally {
    db.close();
  }
}

/* ---------- main ---------- */

async function main(): Promise<number> {
  const installation = prepareInstallation("flueward-crash-");
  const port = await freePort();
  server = new AppServer(port, installation, path.join(installation.dir, "server.log"));
  console.log(`[crash] data in ${installation.dir}, server on ${server.base}`);
  const startTimes: number[] = [await server.start()];
  setUp(true);
  const installer = new Client(server.base, DEMO.installer);
  const supervisor = new Client(server.base, DEMO.supervisor);
  await installer.signIn();
  await supervisor.signIn();
  const signature = await signaturePng();

  const loopStarted = Date.now();
  let kills = 0;
  const done = () => stopping || kills >= MIN_KILLS || Date.now() - loopStarted > LOOP_BUDGET_MS;
  const writers = [
    ...Array.from({ length: WRITERS }, (_, i) => writer(i, installer, done)),
    approver(installer, supervisor, signature, done),
  ];

  // The killer: let traffic run for a random while, kill the whole group, start again.
  while (!done()) {
    // Each life of the server gets some work acknowledged first (a cold start answers its first
    // requests slowly), then dies at a random moment among the writes in flight.
    const wanted = ackCount + randomInt(1, 4);
    for (let waited = 0; ackCount < wanted && waited < 8_000; waited += 10) await sleep(10);
    // Mostly short lives; some long enough for the slow writes (a cold photo upload or approval).
    await sleep(Math.random() < 0.2 ? randomInt(1_000, 3_000) : randomInt(0, 400));
    setUp(false);
    await server.kill("SIGKILL");
    kills += 1;
    startTimes.push(await server.start());
    setUp(true);
  }
  stopping = true;
  setUp(true);
  await Promise.race([Promise.all(writers), sleep(30_000)]);

  // Records acknowledged just before a kill: ask the running server for their hash.
  stopping = false;
  for (const [id, want] of acked.approvals) if (want.recordId === undefined) await fetchRecord(supervisor, id);
  stopping = true;
  await server.kill("SIGKILL");
  kills += 1;
  server.close();

  const result = verify(installation.dbFile, installation.uploadsDir);
  const seconds = ((Date.now() - started) / 1000).toFixed(1);
  const sorted = [...startTimes].sort((a, b) => a - b);
  console.log(
    `[crash] ${kills} SIGKILLs in ${seconds} s; restart to healthy median ${sorted[Math.floor(sorted.length / 2)]} ms, max ${sorted[sorted.length - 1]} ms; ` +
      `${counts.attempted} requests, ${counts.noAnswer} cut off by a kill, ${counts.conflicts} stale-version 409s after a cut-off save`,
  );
  console.log(
    `[crash] acknowledged: ${acked.drafts.size} inspections' latest saves, ${acked.photos.size} photos, ${acked.jobs.size} jobs, ${acked.inspections.size} inspections, ${acked.approvals.size} approvals with records; ${result.tempFiles} leftover temp files (never referenced)`,
  );
  if (refusals.size) console.log(`[crash] other answers: ${[...refusals].map(([k, n]) => `${k} ×${n}`).join(", ")}`);
  for (const line of [...result.lost, ...result.corrupt, ...serverErrors].slice(0, 30)) console.error(`[crash] ${line}`);
  if (serverErrors.length) console.error(`[crash] ${serverErrors.length} server errors (5xx); server log tail:\n${tail(server.logFile)}`);
  const integrityOk = result.integrity === "ok" && result.corrupt.length === 0;
  const enoughKills = kills >= MIN_KILLS;
  if (!enoughKills) console.error(`[crash] only ${kills} kills within the time budget (need ${MIN_KILLS})`);
  console.log(`crash test: ${ackCount} acknowledged writes, ${result.lost.length} lost, ${integrityOk ? "integrity ok" : `integrity FAILED (${result.integrity}; ${result.corrupt.length} problems)`}`);
  const ok = result.lost.length === 0 && integrityOk && serverErrors.length === 0 && enoughKills;
  if (ok && !process.env.CRASH_KEEP) fs.rmSync(installation.dir, { recursive: true, force: true });
  else console.log(`[crash] files kept in ${installation.dir}`);
  return ok ? 0 : 1;
}

main().then(
  (code) => process.exit(code),
  async (error: unknown) => {
    console.error(`crash test: failed to run: ${error instanceof Error ? error.stack : String(error)}`);
    await server?.kill("SIGKILL");
    process.exit(1);
  },
);
