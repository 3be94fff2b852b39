import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import Database from "better-sqlite3";
import fc from "fast-check";
import { z } from "zod";
import { expect, request as playwrightRequest, test, type APIRequestContext } from "@playwright/test";
import { apiAs } from "./support/api";
import { discoverRouteHandlers, fillPattern } from "./support/routes";
import { buildCompanyWorld, fetchWithRetry, createMember, signedInWithOwnPassword, templateInspectionData, type CompanyWorld } from "./support/world";
import { signaturePng } from "./support/signature";
import { changePasswordSchema, signInSchema } from "../../lib/schemas/auth";
import { approveSchema, commentSchema, draftSaveSchema, inspectionCreateSchema, repinSchema, returnSchema, submitSchema } from "../../lib/schemas/inspection";
import { jobFormSchema, jobUpdateSchema } from "../../lib/schemas/job";
import { memberCreateSchema, memberUpdateSchema } from "../../lib/schemas/member";
import { photoUpdateSchema } from "../../lib/schemas/photo";
import { recordEmailSchema, recordRevokeSchema, shareLinkCreateSchema } from "../../lib/schemas/record";
import { rulebookContentSchema, rulebookCreateSchema, rulebookUpdateSchema, rulebookVersionCreateSchema } from "../../lib/schemas/rulebook";
import { siteCheckItemCreateSchema, siteCheckItemUpdateSchema } from "../../lib/schemas/site-check";
import { idSchema } from "../../lib/schemas/common";
import { checkInputSchema } from "../../lib/venting";

/**
 * Bad input: every JSON endpoint found under app/ gets at least 200 generated bodies that its
 * own schema refuses — wrong types, missing and extra fields, huge strings and numbers, NaN-like
 * strings, deep nesting, invalid JSON and UTF-8, oversized bodies, wrong content types. Every
 * answer must be a 4xx in the common error shape, and the refused requests must not change the
 * database.
 */
test.describe.configure({ mode: "serial" });

const BODIES_PER_ENDPOINT = 200;
const CONCURRENCY = 8;
const SEED = Number(process.env.FUZZ_SEED ?? 20_240_611);
const DB_FILE = path.join(process.cwd(), "test-results/e2e-db/flueward.sqlite");
const DEFAULT_LIMIT = 1_000_000;

interface Endpoint {
  ids?: (w: CompanyWorld) => Record<string, string | number>;
  /** A valid body, mutated into bad ones. */
  base: (w: CompanyWorld) => unknown;
  /** Would the server accept this parsed body? Generated bodies it accepts are not sent. */
  accepts: (value: unknown) => boolean;
  limit?: number;
  /** Sent without a session (sign-in). */
  anonymous?: boolean;
}

const by = (schema: z.ZodType) => (value: unknown) => schema.safeParse(value).success;
const contentOk = (content: unknown) => rulebookContentSchema.safeParse(content).success;
const checkRequestSchema = checkInputSchema.extend({ rulebookVersionId: idSchema.optional() });
const CHECK_EXAMPLE = JSON.parse(fs.readFileSync(path.join(process.cwd(), "docs/examples/check-request.json"), "utf8"));
let SIGNATURE = "";
const signature = () => ({ typedName: "Fuzz Tester", signaturePng: SIGNATURE });

const ENDPOINTS: Record<string, Endpoint> = {
  "POST /api/auth/password": { base: () => ({ currentPassword: "x-current-password", newPassword: "lichen-orbit-tallow-9", confirmPassword: "lichen-orbit-tallow-9" }), accepts: by(changePasswordSchema), limit: 10_000 },
  "POST /api/auth/sign-in": { anonymous: true, base: () => ({ email: "nobody@fuzz.test", password: "not-a-password" }), accepts: by(signInSchema), limit: 10_000 },
  "POST /api/check": { base: () => CHECK_EXAMPLE, accepts: by(checkRequestSchema) },
  "POST /api/inspections/:id/approve": { ids: (w) => ({ id: w.approvedInspectionId }), base: () => ({ signature: signature(), password: "x" }), accepts: by(approveSchema), limit: 600_000 },
  "POST /api/inspections/:id/comments": { ids: (w) => ({ id: w.approvedInspectionId }), base: () => ({ section: "general", body: "A comment." }), accepts: by(commentSchema), limit: 20_000 },
  "PUT /api/inspections/:id/draft": { ids: (w) => ({ id: w.draftInspectionId }), base: (w) => ({ version: 1, data: w.draftData }), accepts: by(draftSaveSchema), limit: 2_000_000 },
  "POST /api/inspections/:id/repin": { ids: (w) => ({ id: w.draftInspectionId }), base: (w) => ({ rulebookVersionId: w.pinnedRulebookVersionId }), accepts: by(repinSchema), limit: 10_000 },
  "POST /api/inspections/:id/return": { ids: (w) => ({ id: w.draftInspectionId }), base: () => ({ comments: [{ section: "general", body: "Fix it." }] }), accepts: by(returnSchema), limit: 100_000 },
  "POST /api/inspections/:id/submit": { ids: (w) => ({ id: w.approvedInspectionId }), base: () => ({ version: 1, signature: signature() }), accepts: by(submitSchema), limit: 600_000 },
  "POST /api/jobs/:id/inspections": { ids: (w) => ({ id: w.jobId }), base: (w) => ({ copyAppliancesFrom: w.draftInspectionId }), accepts: by(inspectionCreateSchema), limit: 10_000 },
  "PUT /api/jobs/:id": { ids: (w) => ({ id: w.jobId }), base: (w) => w.job, accepts: by(jobUpdateSchema) },
  "POST /api/jobs": { base: (w) => ({ ...w.job, version: undefined }), accepts: by(jobFormSchema) },
  "PATCH /api/members/:id": { ids: (w) => ({ id: w.memberId }), base: () => ({ role: "installer", active: true }), accepts: by(memberUpdateSchema) },
  "POST /api/members": { base: () => ({ name: "Fuzz Member", email: "fuzz.member@fuzz.test", role: "installer" }), accepts: by(memberCreateSchema) },
  "PATCH /api/photos/:id": { ids: (w) => ({ id: w.photoId }), base: () => ({ caption: "c", tag: "before", segmentId: "seg-1" }), accepts: by(photoUpdateSchema) },
  "POST /api/records/:id/email": { ids: (w) => ({ id: w.recordId }), base: () => ({ to: "fuzz@homeowner.test", audience: "homeowner", expiresInDays: 3, attachPdf: false, idempotencyKey: "fuzz-key-0001" }), accepts: by(recordEmailSchema), limit: 10_000 },
  "POST /api/records/:id/revoke": { ids: (w) => ({ id: w.recordId }), base: () => ({ reason: "Fuzz revocation" }), accepts: by(recordRevokeSchema), limit: 10_000 },
  "POST /api/records/:id/share-links": { ids: (w) => ({ id: w.recordId }), base: () => ({ audience: "homeowner", expiresInDays: 3, label: "l" }), accepts: by(shareLinkCreateSchema), limit: 10_000 },
  "PATCH /api/rulebooks/:id": { ids: (w) => ({ id: w.rulebookId }), base: () => ({ name: "Fuzz", description: "d", status: "active" }), accepts: by(rulebookUpdateSchema) },
  // The route takes content as unknown and the data layer checks it: both must pass.
  "POST /api/rulebooks/:id/versions": {
    ids: (w) => ({ id: w.rulebookId }),
    base: (w) => ({ baseVersionNumber: w.rulebookVersionNumber, changeNote: "n", content: w.rulebookContent }),
    accepts: (v) => by(rulebookVersionCreateSchema)(v) && contentOk((v as { content?: unknown }).content),
    limit: 5_000_000,
  },
  "POST /api/rulebooks": {
    base: (w) => ({ name: "Fuzz rulebook", description: "", content: w.rulebookContent }),
    accepts: (v) => {
      const parsed = rulebookCreateSchema.safeParse(v);
      return parsed.success && (parsed.data.copyFromRulebookId !== undefined || contentOk(parsed.data.content));
    },
    limit: 5_000_000,
  },
  "PATCH /api/site-checks/:id": { ids: (w) => ({ id: w.siteCheckItem.id }), base: () => ({ label: "Fuzz label", help: "", appliesTo: "all", active: true, sortOrder: 1 }), accepts: by(siteCheckItemUpdateSchema) },
  "PUT /api/site-checks/order": { base: (w) => ({ ids: w.siteCheckIds }), accepts: by(z.object({ ids: z.array(idSchema).min(1) })) },
  "POST /api/site-checks": { base: () => ({ label: "Fuzz item", help: "", appliesTo: "all" }), accepts: by(siteCheckItemCreateSchema) },
};

// ---------------------------------------------------------------------------------------------
// Bad bodies

interface BadBody {
  kind: string;
  bytes: Buffer;
  contentType: string;
  /** Refused whatever the parsed value (wrong content type, oversized): no oracle needed. */
  alwaysRefused?: boolean;
}

const NAN_LIKE = ["NaN", "Infinity", "-Infinity", "1e309", "-1e309", "0x1F", "1_000", "", " ", "null", "undefined", "true", "\u0000", "\u202e", "💥".repeat(20)];
const HUGE_NUMBERS = [-1, -0.5, 0, 1.5, 2 ** 31, 2 ** 53 + 2, 1e21, 1e308, -1e308, Number.MIN_VALUE, -(2 ** 63)];

const badScalar = fc.oneof(
  fc.constant(null),
  fc.boolean(),
  fc.integer(),
  fc.double(),
  fc.constantFrom(...HUGE_NUMBERS),
  fc.constantFrom(...NAN_LIKE),
  fc.string({ maxLength: 40 }),
  fc.string({ unit: "binary", maxLength: 40 }),
  fc.constant("x".repeat(20_000)),
);
const badValue = fc.oneof(
  { weight: 4, arbitrary: badScalar },
  { weight: 1, arbitrary: fc.array(badScalar, { maxLength: 5 }) },
  { weight: 1, arbitrary: fc.dictionary(fc.string({ maxLength: 8 }), badScalar, { maxKeys: 4 }) },
  { weight: 1, arbitrary: fc.jsonValue({ maxDepth: 3 }) },
);

type PathStep = string | number;
function pathsOf(value: unknown, prefix: PathStep[] = [], out: PathStep[][] = []): PathStep[][] {
  if (out.length > 400 || prefix.length > 6) return out;
  if (Array.isArray(value)) value.slice(0, 3).forEach((v, i) => { out.push([...prefix, i]); pathsOf(v, [...prefix, i], out); });
  else if (value && typeof value === "object") for (const [k, v] of Object.entries(value)) { out.push([...prefix, k]); pathsOf(v, [...prefix, k], out); }
  return out;
}

function setAt(root: unknown, at: PathStep[], replace: (old: unknown) => unknown | typeof DELETE): unknown {
  const copy = structuredClone(root) as Record<string | number, unknown>;
  let node: Record<string | number, unknown> = copy;
  for (const step of at.slice(0, -1)) {
    const child = node?.[step];
    // An earlier mutation may have removed or replaced this part: leave the value as it is.
    if (!child || typeof child !== "object") return copy;
    node = child as Record<string | number, unknown>;
  }
  if (!node || typeof node !== "object") return copy;
  const last = at[at.length - 1]!;
  const next = replace(node[last]);
  if (next === DELETE) {
    if (Array.isArray(node)) node.splice(Number(last), 1);
    else delete node[last];
  } else node[last] = next;
  return copy;
}
const DELETE = Symbol("delete");

/** Structured mutations of a valid body: one to three field replacements, deletions or additions. */
function mutations(base: unknown): fc.Arbitrary<unknown> {
  const paths = pathsOf(base);
  const one = (value: unknown): fc.Arbitrary<unknown> => {
    const options: fc.Arbitrary<unknown>[] = [
      fc.record({ extra: fc.string({ maxLength: 12 }), v: fc.jsonValue({ maxDepth: 2 }) }).map(({ extra, v }) => (value && typeof value === "object" && !Array.isArray(value) ? { ...value, [`x_${extra}`]: v } : value)),
    ];
    if (paths.length) {
      options.push(fc.tuple(fc.constantFrom(...paths), badValue).map(([at, v]) => setAt(value, at, () => v)));
      options.push(fc.constantFrom(...paths).map((at) => setAt(value, at, () => DELETE)));
    }
    return fc.oneof(...options);
  };
  return fc.oneof(
    { weight: 5, arbitrary: one(base) },
    { weight: 3, arbitrary: one(base).chain((v) => one(v)) },
    { weight: 2, arbitrary: one(base).chain((v) => one(v)).chain((v) => one(v)) },
    { weight: 1, arbitrary: badValue },
  );
}

const json = (value: unknown) => Buffer.from(JSON.stringify(value) ?? "null");

function rawTexts(base: unknown, limit: number): BadBody[] {
  const text = JSON.stringify(base);
  const ct = "application/json";
  const deepArray = "[".repeat(10_000) + "]".repeat(10_000);
  const deepObject = '{"a":'.repeat(10_000) + "1" + "}".repeat(10_000);
  const firstKey = base && typeof base === "object" && !Array.isArray(base) ? Object.keys(base)[0] ?? "a" : "a";
  const bodies: BadBody[] = [
    { kind: "empty", bytes: Buffer.alloc(0), contentType: ct },
    { kind: "truncated", bytes: Buffer.from(text.slice(0, Math.max(1, Math.floor(text.length / 2)))), contentType: ct },
    { kind: "trailing garbage", bytes: Buffer.from(`${text}}`), contentType: ct },
    { kind: "single quotes", bytes: Buffer.from(text.replaceAll('"', "'")), contentType: ct },
    { kind: "NaN literal", bytes: Buffer.from(`{"${firstKey}": NaN}`), contentType: ct },
    { kind: "Infinity literal", bytes: Buffer.from(`{"${firstKey}": Infinity}`), contentType: ct },
    { kind: "1e309", bytes: Buffer.from(`{"${firstKey}": 1e309}`), contentType: ct },
    { kind: "huge integer", bytes: Buffer.from(`{"${firstKey}": 123456789012345678901234567890123456789}`), contentType: ct },
    { kind: "deep array", bytes: Buffer.from(deepArray), contentType: ct },
    { kind: "deep object", bytes: Buffer.from(deepObject), contentType: ct },
    { kind: "deep field", bytes: Buffer.from(text.replace(/^\{/, `{"${firstKey}":${deepArray},`)), contentType: ct },
    { kind: "proto pollution", bytes: Buffer.from(`{"__proto__":{"role":"admin","isAdmin":true},"constructor":{"prototype":{"x":1}}}`), contentType: ct },
    { kind: "duplicate keys", bytes: Buffer.from(text.replace(/^\{/, `{"${firstKey}":{"nested":[1,2,3]},`)), contentType: ct },
    { kind: "BOM", bytes: Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(text)]), contentType: ct },
    { kind: "top-level string", bytes: Buffer.from('"just a string"'), contentType: ct },
    { kind: "top-level number", bytes: Buffer.from("1e309"), contentType: ct },
    { kind: "top-level null", bytes: Buffer.from("null"), contentType: ct },
    { kind: "array of bodies", bytes: Buffer.from(`[${text},${text}]`), contentType: ct },
    { kind: "huge string field", bytes: json({ ...(typeof base === "object" ? base : {}), [firstKey]: "x".repeat(1_000_000) }), contentType: ct },
    { kind: "huge string field, charset", bytes: json({ [firstKey]: "é".repeat(600_000) }), contentType: "application/json; charset=utf-8" },
    // Invalid UTF-8 inside an otherwise well-formed body.
    { kind: "invalid utf-8 (ff)", bytes: Buffer.concat([Buffer.from(`{"${firstKey}":"`), Buffer.from([0xff, 0xfe, 0xfd]), Buffer.from('"}')]), contentType: ct },
    { kind: "invalid utf-8 (overlong)", bytes: Buffer.concat([Buffer.from(`{"${firstKey}":"`), Buffer.from([0xc0, 0xaf]), Buffer.from('"}')]), contentType: ct },
    { kind: "invalid utf-8 (lone surrogate)", bytes: Buffer.concat([Buffer.from(`{"${firstKey}":"`), Buffer.from([0xed, 0xa0, 0x80]), Buffer.from('"}')]), contentType: ct },
    { kind: "invalid utf-8 (truncated)", bytes: Buffer.concat([Buffer.from(text.slice(0, -2)), Buffer.from([0xe2, 0x82])]), contentType: ct },
    { kind: "utf-16", bytes: Buffer.from(text, "utf16le"), contentType: ct },
    // Wrong content types, with a body the schema would accept.
    ...["text/plain", "application/x-www-form-urlencoded", "multipart/form-data; boundary=xyz", "application/jso", "text/json", "application/xml", ""].map((type) => ({
      kind: `content type "${type}"`,
      bytes: Buffer.from(text),
      contentType: type,
      alwaysRefused: true,
    })),
    // Oversized: declared and real length over the route's limit.
    { kind: "oversized", bytes: Buffer.from(`{"${firstKey}":"${"a".repeat(limit + 10)}"}`), contentType: ct, alwaysRefused: true },
    { kind: "oversized whitespace", bytes: Buffer.concat([Buffer.from(text), Buffer.alloc(limit + 1, 0x20)]), contentType: ct, alwaysRefused: true },
  ];
  return bodies;
}

function generatedTexts(seed: number): BadBody[] {
  return fc
    .sample(
      fc.oneof(
        fc.string({ maxLength: 60 }),
        fc.string({ unit: "binary", maxLength: 60 }),
        fc.uint8Array({ maxLength: 60 }).map((a) => Buffer.from(a).toString("latin1")),
        fc.jsonValue({ maxDepth: 2 }).map((v) => JSON.stringify(v).slice(0, -1)),
      ),
      { numRuns: 20, seed },
    )
    .map((t) => ({ kind: "generated text", bytes: Buffer.from(t, "latin1"), contentType: "application/json" }));
}

/** Would the server's parse (UTF-8, JSON, schema) accept these bytes? */
function serverWouldAccept(body: BadBody, endpoint: Endpoint, limit: number): boolean {
  if (body.alwaysRefused || body.bytes.byteLength > limit) return false;
  if (!body.contentType.toLowerCase().includes("application/json")) return false;
  let value: unknown;
  try {
    value = JSON.parse(new TextDecoder("utf-8", { fatal: true }).decode(body.bytes));
  } catch {
    return false;
  }
  try {
    return endpoint.accepts(value);
  } catch {
    return false; // e.g. the schema itself overflowing on deep nesting: the server must refuse too
  }
}

function badBodies(key: string, endpoint: Endpoint, world: CompanyWorld, seed: number): BadBody[] {
  const base = endpoint.base(world);
  const limit = endpoint.limit ?? DEFAULT_LIMIT;
  const out: BadBody[] = [];
  const seen = new Set<string>();
  const add = (body: BadBody) => {
    const id = `${body.contentType}|${crypto.createHash("sha1").update(body.bytes).digest("hex")}`;
    if (seen.has(id) || serverWouldAccept(body, endpoint, limit)) return;
    seen.add(id);
    out.push(body);
  };
  for (const body of rawTexts(base, limit)) add(body);
  for (const body of generatedTexts(seed)) add(body);
  // Structured bodies until there are enough; bounded rounds.
  for (let round = 0; out.length < BODIES_PER_ENDPOINT + 5 && round < 10; round++) {
    for (const value of fc.sample(mutations(base), { numRuns: 100, seed: seed + round * 7919 })) add({ kind: "mutated", bytes: json(value), contentType: "application/json" });
  }
  if (out.length < BODIES_PER_ENDPOINT) throw new Error(`${key}: only ${out.length} bad bodies generated`);
  return out;
}

// ---------------------------------------------------------------------------------------------
// The database before and after

function tableFingerprints(): Record<string, string> {
  const db = new Database(DB_FILE, { readonly: true, fileMustExist: true });
  try {
    const tables = (db.prepare("select name from sqlite_master where type = 'table' and name not like 'sqlite_%' order by name").all() as { name: string }[])
      .map((t) => t.name)
      .filter((name) => name !== "sessions" && name !== "login_attempts");
    const out: Record<string, string> = {};
    for (const table of tables) {
      const columns = new Set((db.prepare(`pragma table_info("${table}")`).all() as { name: string }[]).map((c) => c.name));
      const parts = ["count(*)"];
      if (columns.has("id")) parts.push("max(id)");
      if (columns.has("updated_at")) parts.push("max(updated_at)");
      out[table] = JSON.stringify(db.prepare(`select ${parts.join(", ")} from "${table}"`).raw().get());
    }
    return out;
  } finally {
    db.close();
  }
}

/** The rows this test's requests could touch: its own objects and anything its actor did. */
function scopedFingerprint(world: CompanyWorld, actorUserId: number): string {
  const db = new Database(DB_FILE, { readonly: true, fileMustExist: true });
  try {
    const has = (table: string) => Boolean(db.prepare("select 1 from sqlite_master where type='table' and name = ?").get(table));
    const rows = (sql: string, ...params: unknown[]) => JSON.stringify(db.prepare(sql).all(...params));
    const inspections = `select id from inspections where job_id = ${Number(world.jobId)}`;
    const parts = [
      rows("select * from audit_events where actor_user_id = ? order by id", actorUserId),
      rows("select * from jobs where id = ? or created_by = ?", world.jobId, actorUserId),
      rows(`select * from inspections where job_id = ? order by id`, world.jobId),
      rows("select * from users where id in (?, ?) order by id", world.memberId, actorUserId),
      has("photos") ? rows(`select * from photos where inspection_id in (${inspections}) order by id`) : "",
      has("inspection_comments") ? rows(`select * from inspection_comments where inspection_id in (${inspections}) order by id`) : "",
      has("records") ? rows("select * from records where id = ?", world.recordId) : "",
      has("share_links") ? rows("select * from share_links where record_id = ? order by id", world.recordId) : "",
      has("email_sends") ? rows("select * from email_sends where record_id = ? order by id", world.recordId) : "",
      rows("select * from rulebooks where id = ?", world.rulebookId),
      rows("select id, version_number from rulebook_versions where rulebook_id = ? order by id", world.rulebookId),
      has("site_check_items") ? rows("select * from site_check_items where id = ?", world.siteCheckItem.id) : "",
    ];
    return crypto.createHash("sha256").update(parts.join("\n")).digest("hex");
  } finally {
    db.close();
  }
}

async function pool<T>(items: T[], limit: number, work: (item: T) => Promise<void>): Promise<void> {
  let next = 0;
  await Promise.all(Array.from({ length: Math.min(limit, items.length) }, async () => { while (next < items.length) await work(items[next++]!); }));
}

test("fuzz: every JSON endpoint refuses bad bodies with a 4xx in the common shape and writes nothing", async ({ baseURL }) => {
  test.setTimeout(300_000);
  SIGNATURE = await signaturePng();

  // Every JSON endpoint under app/ must have an entry, and every entry a route.
  const jsonHandlers = discoverRouteHandlers().filter((h) => h.readsJson && h.method !== "GET" && h.method !== "DELETE");
  const discovered = new Set(jsonHandlers.map((h) => h.key));
  expect([...discovered].filter((k) => !(k in ENDPOINTS)), "JSON endpoints with no fuzz entry").toEqual([]);
  expect(Object.keys(ENDPOINTS).filter((k) => !discovered.has(k)), "fuzz entries for endpoints that no longer exist").toEqual([]);

  // A dedicated admin of company A: its audit trail shows whether a refused request wrote anything.
  const adminA = await apiAs(baseURL!, "admin");
  const fuzzer = await createMember(adminA, "admin", "fuzzer");
  const { api, password: fuzzerPassword } = await signedInWithOwnPassword(baseURL!, fuzzer);
  const world = await buildCompanyWorld({ admin: api, approver: api, approverName: "Security fuzzer", approverPassword: fuzzerPassword, templateData: await templateInspectionData(api) });
  const anonymous = await playwrightRequest.newContext({ baseURL });

  let sent = 0;
  let serverErrors = 0;
  const failures: string[] = [];
  const concurrentNotes: string[] = [];
  const started = Date.now();

  for (const [index, handler] of jsonHandlers.entries()) {
    const endpoint = ENDPOINTS[handler.key]!;
    const url = fillPattern(handler.pattern, endpoint.ids?.(world) ?? {});
    const generationStarted = Date.now();
    const bodies = badBodies(handler.key, endpoint, world, SEED + index * 104_729);
    const sendingStarted = Date.now();
    const client: APIRequestContext = endpoint.anonymous ? anonymous : api;

    const globalBefore = tableFingerprints();
    const scopedBefore = scopedFingerprint(world, fuzzer.id);
    await pool(bodies, CONCURRENCY, async (body) => {
      const headers: Record<string, string> = body.contentType ? { "content-type": body.contentType } : {};
      const response = await fetchWithRetry(client, url, { method: handler.method, headers, data: body.bytes, failOnStatusCode: false, maxRedirects: 0 });
      sent++;
      const status = response.status();
      const text = await response.text();
      const label = `${handler.method} ${url} [${body.kind}, ${body.bytes.byteLength} B, ${body.contentType || "no content type"}] → ${status}`;
      if (status >= 500) serverErrors++;
      if (status < 400 || status >= 500) {
        failures.push(`${label}: ${text.slice(0, 200)} ← ${body.bytes.subarray(0, 160).toString("latin1")}`);
        return;
      }
      let parsed: { error?: { code?: unknown; message?: unknown } } | undefined;
      try {
        parsed = JSON.parse(text);
      } catch {
        parsed = undefined;
      }
      if (typeof parsed?.error?.code !== "string" || typeof parsed.error.message !== "string" || !parsed.error.message.trim()) {
        failures.push(`${label}: not the common error shape: ${text.slice(0, 200)}`);
      }
    });
    const globalAfter = tableFingerprints();
    const changedTables = Object.keys({ ...globalBefore, ...globalAfter }).filter((t) => globalBefore[t] !== globalAfter[t]);
    if (changedTables.length) {
      // Another worker's spec may write meanwhile: then this test's own rows and audit trail decide.
      if (scopedFingerprint(world, fuzzer.id) !== scopedBefore) failures.push(`${handler.key}: refused requests changed the database (tables ${changedTables.join(", ")})`);
      else concurrentNotes.push(`${handler.key}: ${changedTables.join(", ")}`);
    }
    console.log(`[fuzz] ${handler.key}: ${bodies.length} bad bodies (generated in ${sendingStarted - generationStarted} ms, sent in ${Date.now() - sendingStarted} ms)`);
  }

  if (concurrentNotes.length) console.log(`[fuzz] tables changed by other tests during a batch (this test's rows and audit trail unchanged): ${concurrentNotes.join("; ")}`);
  console.log(`fuzz: ${sent} requests sent to ${jsonHandlers.length} JSON endpoints in ${((Date.now() - started) / 1000).toFixed(0)} s, ${serverErrors} 5xx (seed ${SEED})`);
  for (const f of failures.slice(0, 40)) console.error(`[fuzz] ${f}`);
  expect(failures.length, failures.slice(0, 10).join("\n")).toBe(0);
  expect(serverErrors).toBe(0);
});
