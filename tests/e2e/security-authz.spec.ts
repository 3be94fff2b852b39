import { createHash } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { expect, request as playwrightRequest, test, type APIRequestContext, type APIResponse } from "@playwright/test";
import { DEMO_ACCOUNTS } from "./support/accounts";
import { apiAs } from "./support/api";
import { signaturePng } from "./support/signature";
import { discoverRouteHandlers, discoverServerActionFiles, fillPattern } from "./support/routes";
import { buildCompanyWorld, fetchWithRetry, templateInspectionData, createMember, createShareToken, jpegBytes, signedIn, unique, uploadPhoto, type CompanyWorld } from "./support/world";
import { RULEBOOK_TABLE_KEYS } from "../../lib/venting";

/**
 * Who may do what: every route handler found under app/ is called by every persona, with ids
 * of the caller's own company and of the other one, and each answer is compared with what the
 * table below allows. Any unexpected allow fails the test.
 */
test.describe.configure({ mode: "serial" });

type PersonaName = "anonymous" | "installer" | "supervisor" | "admin" | "deactivated" | "otherCompanyAdmin" | "shareHolder";
type Company = "A" | "B";
type Owner = "none" | Company | "revoked";
/** "nobody": the route answers 404 to everyone in a normal run (e.g. the benchmark ceiling). */
type Who = "public" | "members" | "reviewers" | "admins" | "nobody";

interface Persona {
  name: PersonaName;
  company: Company | null;
  role: "installer" | "supervisor" | "admin" | null;
  api: APIRequestContext;
  password: string;
  displayName: string;
}

interface CellContext {
  persona: Persona;
  owner: Owner;
  /** The world of the id owner, or of the persona's own company for routes without ids. */
  world: CompanyWorld;
  worlds: Record<Company, CompanyWorld>;
}

type RequestOptions = { data?: unknown; multipart?: Record<string, unknown>; headers?: Record<string, string> };

interface Rule {
  who: Who;
  /** 1 ordinary; 2 destructive (after 1); 3 sign-in; 4 sign-out (last, it ends sessions). */
  phase?: 1 | 2 | 3 | 4;
  ids?: (world: CompanyWorld, owner: Owner) => Record<string, string | number>;
  /** Fresh ids for one cell, for calls that use their object up (deletes). */
  fresh?: (c: CellContext) => Promise<Record<string, string | number>>;
  query?: string;
  body?: (c: CellContext) => RequestOptions | Promise<RequestOptions>;
  owners?: Owner[];
  /** Being added by another change: not an error while the route file is still absent. */
  inFlight?: boolean;
}

const DENY_STATUSES = new Set([401, 403, 404, 410]);
const CHECK_EXAMPLE = (() => {
  const example = JSON.parse(fs.readFileSync(path.join(process.cwd(), "docs/examples/check-request.json"), "utf8"));
  delete example.rulebookVersionId; // each company's current rulebook
  return example;
})();
const TINY_PDF = Buffer.from("%PDF-1.4\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n");

let signInTarget: { email: string; password: string };
const adminApis: Partial<Record<Company, APIRequestContext>> = {};

const signatureBody = async (c: CellContext) => ({ typedName: c.persona.displayName || "Someone Else", signaturePng: await signaturePng() });
const inspectionIds = (kind: "draftInspectionId" | "approvedInspectionId") => (w: CompanyWorld) => ({ id: w[kind] });

/** METHOD /pattern → who may call it, with which ids and body. Every discovered route needs one. */
const MATRIX: Record<string, Rule> = {
  "GET /share/:token": { who: "public", owners: ["A", "B", "revoked"], ids: (w, o) => ({ token: o === "revoked" ? w.revokedToken : w.token }) },
  "GET /share/:token/pdf": { who: "public", owners: ["A", "B", "revoked"], ids: (w, o) => ({ token: o === "revoked" ? w.revokedToken : w.token }) },
  // A wrong current password: authorised callers get 400, nobody's password changes.
  "POST /api/auth/password": {
    who: "members",
    body: () => ({ data: { currentPassword: "not-the-current-password", newPassword: "lichen-orbit-tallow-9", confirmPassword: "lichen-orbit-tallow-9" } }),
  },
  "POST /api/auth/sign-in": { who: "public", phase: 3, body: () => ({ data: signInTarget }) },
  "POST /api/auth/sign-out": { who: "public", phase: 4 },
  "POST /api/check": { who: "members", body: () => ({ data: CHECK_EXAMPLE }) },
  "GET /api/dev/outbox": { who: "members", query: "?limit=1" },
  "POST /api/email-sends/:id/retry": { who: "reviewers", ids: (w) => ({ id: w.emailSendId }) },
  "GET /api/health": { who: "public" },
  // Already approved: an authorised caller with the right password gets 409.
  "POST /api/inspections/:id/approve": {
    who: "reviewers",
    ids: inspectionIds("approvedInspectionId"),
    body: async (c) => ({ data: { signature: await signatureBody(c), password: c.persona.password || "no-password" } }),
  },
  "POST /api/inspections/:id/comments": { who: "reviewers", ids: inspectionIds("approvedInspectionId"), body: () => ({ data: { section: "general", body: "Security test comment." } }) },
  "PUT /api/inspections/:id/draft": { who: "members", ids: inspectionIds("draftInspectionId"), body: (c) => ({ data: { version: 1, data: c.world.draftData } }) },
  "GET /api/inspections/:id/photos": { who: "members", ids: inspectionIds("draftInspectionId") },
  "POST /api/inspections/:id/photos": {
    who: "members",
    ids: inspectionIds("draftInspectionId"),
    body: async () => ({ multipart: { file: { name: "flue.jpg", mimeType: "image/jpeg", buffer: await jpegBytes() } } }),
  },
  "GET /api/inspections/:id/record": { who: "members", ids: inspectionIds("approvedInspectionId") },
  "POST /api/inspections/:id/repin": { who: "reviewers", ids: inspectionIds("draftInspectionId"), body: (c) => ({ data: { rulebookVersionId: c.world.pinnedRulebookVersionId } }) },
  // A draft cannot be returned: authorised callers get 422.
  "POST /api/inspections/:id/return": { who: "reviewers", ids: inspectionIds("draftInspectionId"), body: () => ({ data: { comments: [{ section: "general", body: "Security test." }] } }) },
  "POST /api/inspections/:id/revise": { who: "reviewers", phase: 2, ids: inspectionIds("approvedInspectionId") },
  "GET /api/inspections/:id": { who: "members", ids: inspectionIds("draftInspectionId") },
  // Approved inspections cannot be submitted: authorised callers get 422.
  "POST /api/inspections/:id/submit": { who: "members", ids: inspectionIds("approvedInspectionId"), body: async (c) => ({ data: { version: 1, signature: await signatureBody(c) } }) },
  // Without a status the list is the review queue, which installers may not read.
  "GET /api/inspections": { who: "reviewers" },
  "GET /api/installers": { who: "members" },
  "GET /api/jobs/:id/inspections": { who: "members", ids: (w) => ({ id: w.jobId }) },
  "POST /api/jobs/:id/inspections": { who: "members", ids: (w) => ({ id: w.jobId }), body: () => ({ data: {} }) },
  "GET /api/jobs/:id": { who: "members", ids: (w) => ({ id: w.jobId }) },
  "PUT /api/jobs/:id": { who: "members", ids: (w) => ({ id: w.jobId }), body: (c) => ({ data: c.world.job }) },
  "GET /api/jobs": { who: "members" },
  "POST /api/jobs": { who: "members", body: () => ({ data: { customerName: `Security Test ${unique("job")}`, siteStreet: "2 Test Row", siteCity: "Testbury" } }) },
  "GET /api/me": { who: "members" },
  "GET /api/members/:id": { who: "admins", ids: (w) => ({ id: w.memberId }) },
  "PATCH /api/members/:id": { who: "admins", ids: (w) => ({ id: w.memberId }), body: () => ({ data: { role: "installer" } }) },
  "GET /api/members": { who: "admins" },
  "POST /api/members": { who: "admins", body: () => ({ data: { name: "Security Created", email: `${unique("created")}@security.test`, role: "installer" } }) },
  "GET /api/photos/:id": { who: "members", ids: (w) => ({ id: w.photoId }) },
  "PATCH /api/photos/:id": { who: "members", ids: (w) => ({ id: w.photoId }), body: () => ({ data: { caption: "security test caption" } }) },
  "DELETE /api/photos/:id": { who: "members", fresh: async (c) => ({ id: await uploadPhoto(adminApis[c.owner as Company]!, c.world.draftInspectionId) }) },
  "GET /api/records/:id/pdf": { who: "members", ids: (w) => ({ id: w.recordId }) },
  "POST /api/records/:id/email": { who: "reviewers", ids: (w) => ({ id: w.recordId }), body: () => ({ data: { to: "security.matrix@homeowner.test", idempotencyKey: unique("key") } }) },
  "POST /api/records/:id/revoke": { who: "reviewers", phase: 2, ids: (w) => ({ id: w.recordId }), body: () => ({ data: { reason: "Security test revocation." } }) },
  "POST /api/records/:id/share-links": { who: "reviewers", ids: (w) => ({ id: w.recordId }), body: () => ({ data: { audience: "homeowner", expiresInDays: 1 } }) },
  "GET /api/rulebooks/:id": { who: "members", ids: (w) => ({ id: w.rulebookId }) },
  "PATCH /api/rulebooks/:id": { who: "reviewers", ids: (w) => ({ id: w.rulebookId }), body: () => ({ data: { description: "Security test copy." } }) },
  "GET /api/rulebooks/:id/versions/:version/csv/:table": { who: "members", ids: (w) => ({ id: w.rulebookId, version: 1, table: RULEBOOK_TABLE_KEYS[0]! }) },
  "GET /api/rulebooks/:id/versions/:version": { who: "members", ids: (w) => ({ id: w.rulebookId, version: 1 }) },
  // The first authorised call saves version 2; later ones are stale (409).
  "POST /api/rulebooks/:id/versions": {
    who: "reviewers",
    ids: (w) => ({ id: w.rulebookId }),
    body: (c) => ({ data: { baseVersionNumber: c.world.rulebookVersionNumber, changeNote: "Security test save.", content: c.world.rulebookContent } }),
  },
  "GET /api/rulebooks": { who: "members" },
  "POST /api/rulebooks": { who: "reviewers", body: (c) => ({ data: { name: `Security copy ${unique("rb")}`, copyFromRulebookId: c.world.defaultRulebookId } }) },
  "DELETE /api/share-links/:id": { who: "reviewers", fresh: async (c) => ({ id: (await createShareToken(adminApis[c.owner as Company]!, c.world.recordId)).id }) },
  // The item's own help text again: a write that changes nothing other specs could see.
  "PATCH /api/site-checks/:id": { who: "admins", ids: (w) => ({ id: w.siteCheckItem.id }), body: (c) => ({ data: { help: c.world.siteCheckItem.help } }) },
  "PUT /api/site-checks/order": { who: "admins", body: (c) => ({ data: { ids: c.world.siteCheckIds } }) },
  "GET /api/site-checks": { who: "members" },
  // Too short a label: authorised callers get 400, so no item joins the list other specs use.
  "POST /api/site-checks": { who: "admins", body: () => ({ data: { label: "x" } }) },
  // Exists only while FLUEWARD_BENCH=1 (benchmarks); a plain 404 in every other run.
  "GET /api/bench/ping": { who: "nobody" },
  "GET /api/verify": { who: "public", query: "?code=ZZZZ-ZZZZ-ZZZZ" },
  "POST /api/verify": { who: "public", body: () => ({ multipart: { file: { name: "record.pdf", mimeType: "application/pdf", buffer: TINY_PDF } } }) },
};

/** Server actions ("use server" files) and what guards them; none exist yet. */
const SERVER_ACTIONS: Record<string, Who> = {};

function expectedOutcome(rule: Rule, persona: Persona, owner: Owner): "allow" | "deny" {
  if (owner === "revoked" || rule.who === "nobody") return "deny";
  if (rule.who === "public") return "allow";
  if (!persona.role) return "deny";
  const roles: string[] = { members: ["installer", "supervisor", "admin"], reviewers: ["supervisor", "admin"], admins: ["admin"] }[rule.who];
  if (!roles.includes(persona.role)) return "deny";
  if (owner === "A" || owner === "B") return persona.company === owner ? "allow" : "deny";
  return "allow";
}

async function send(api: APIRequestContext, method: string, url: string, options: RequestOptions): Promise<APIResponse> {
  return fetchWithRetry(api, url, { method, ...options, maxRedirects: 0, failOnStatusCode: false } as Parameters<APIRequestContext["fetch"]>[1]);
}

async function pool<T>(items: T[], limit: number, work: (item: T) => Promise<void>): Promise<void> {
  let next = 0;
  await Promise.all(
    Array.from({ length: Math.min(limit, items.length) }, async () => {
      while (next < items.length) await work(items[next++]!);
    }),
  );
}

function cookieValue(state: { cookies: { name: string; value: string }[] }): { name: string; value: string } {
  const cookie = state.cookies.find((c) => c.name.endsWith("flueward-session"));
  if (!cookie) throw new Error("no session cookie");
  return cookie;
}

async function withCookie(baseURL: string, cookie: { name: string; value: string }): Promise<APIRequestContext> {
  return playwrightRequest.newContext({ baseURL, extraHTTPHeaders: { cookie: `${cookie.name}=${cookie.value}` } });
}

test("authorization matrix: every route × persona × id owner", async ({ baseURL }) => {
  test.setTimeout(240_000);

  // The matrix and the app folder must name the same handlers.
  const handlers = discoverRouteHandlers();
  const discovered = new Set(handlers.map((h) => h.key));
  const missing = [...discovered].filter((key) => !(key in MATRIX));
  const stale = Object.keys(MATRIX).filter((key) => !discovered.has(key) && !MATRIX[key]!.inFlight);
  expect(missing, `route handlers with no matrix entry (add them to MATRIX in ${path.basename(__filename)})`).toEqual([]);
  expect(stale, "matrix entries for routes that no longer exist").toEqual([]);
  const actionFiles = discoverServerActionFiles();
  expect(actionFiles.filter((f) => !(f in SERVER_ACTIONS)), "server-action files with no matrix entry").toEqual([]);

  // Objects of both companies, made through the API by their own members.
  const supervisor = await apiAs(baseURL!, "supervisor");
  const adminA = await apiAs(baseURL!, "admin");
  const adminB = await apiAs(baseURL!, "otherCompanyAdmin");
  adminApis.A = adminA;
  adminApis.B = adminB;
  const templateData = await templateInspectionData(adminA);
  const worlds: Record<Company, CompanyWorld> = {
    A: await buildCompanyWorld({ templateData, admin: adminA, approver: supervisor, submitter: await apiAs(baseURL!, "installer"), approverName: DEMO_ACCOUNTS.supervisor.name, approverPassword: DEMO_ACCOUNTS.supervisor.password, assignInstallerName: DEMO_ACCOUNTS.installer.name }),
    B: await buildCompanyWorld({ templateData, admin: adminB, approver: adminB, approverName: DEMO_ACCOUNTS.otherCompanyAdmin.name, approverPassword: DEMO_ACCOUNTS.otherCompanyAdmin.password }),
  };

  // A member who signed in and was then deactivated: the cookie they hold must be refused.
  const former = await createMember(adminA, "installer", "deactivated");
  const deactivatedApi = await signedIn(baseURL!, former.email, former.password);
  expect((await deactivatedApi.get("/api/me")).status()).toBe(200);
  expect((await adminA.patch(`/api/members/${former.id}`, { data: { active: false } })).status()).toBe(200);
  expect((await deactivatedApi.get("/api/me")).status()).toBe(401);

  const target = await createMember(adminA, "installer", "signin-target");
  signInTarget = { email: target.email, password: target.password };

  // The share-link holder has no cookie, only the link (opened once, as a recipient would).
  const shareApi = await playwrightRequest.newContext({ baseURL });
  expect((await shareApi.get(`/share/${worlds.A.token}`)).status()).toBe(200);

  const personas: Persona[] = [
    { name: "anonymous", company: null, role: null, api: await playwrightRequest.newContext({ baseURL }), password: "", displayName: "" },
    { name: "installer", company: "A", role: "installer", api: await apiAs(baseURL!, "installer"), password: DEMO_ACCOUNTS.installer.password, displayName: DEMO_ACCOUNTS.installer.name },
    { name: "supervisor", company: "A", role: "supervisor", api: await apiAs(baseURL!, "supervisor"), password: DEMO_ACCOUNTS.supervisor.password, displayName: DEMO_ACCOUNTS.supervisor.name },
    { name: "admin", company: "A", role: "admin", api: await apiAs(baseURL!, "admin"), password: DEMO_ACCOUNTS.admin.password, displayName: DEMO_ACCOUNTS.admin.name },
    { name: "deactivated", company: null, role: null, api: deactivatedApi, password: former.password, displayName: "Security deactivated" },
    { name: "otherCompanyAdmin", company: "B", role: "admin", api: await apiAs(baseURL!, "otherCompanyAdmin"), password: DEMO_ACCOUNTS.otherCompanyAdmin.password, displayName: DEMO_ACCOUNTS.otherCompanyAdmin.name },
    { name: "shareHolder", company: null, role: null, api: shareApi, password: "", displayName: "" },
  ];

  interface Cell {
    key: string;
    method: string;
    pattern: string;
    rule: Rule;
    persona: Persona;
    owner: Owner;
    expected: "allow" | "deny";
    status?: number;
    url?: string;
    text?: string;
  }
  const cells: Cell[] = [];
  for (const handler of handlers) {
    const rule = MATRIX[handler.key]!;
    const owners: Owner[] = rule.owners ?? (handler.params.length ? ["A", "B"] : ["none"]);
    for (const persona of personas) {
      for (const owner of owners) cells.push({ key: handler.key, method: handler.method, pattern: handler.pattern, rule, persona, owner, expected: expectedOutcome(rule, persona, owner) });
    }
  }

  for (const phase of [1, 2, 3, 4] as const) {
    await pool(
      cells.filter((c) => (c.rule.phase ?? 1) === phase),
      phase === 1 ? 6 : 3,
      async (cell) => {
        const world = cell.owner === "A" || cell.owner === "B" ? worlds[cell.owner] : cell.owner === "revoked" ? worlds.A : worlds[cell.persona.company ?? "A"];
        const context: CellContext = { persona: cell.persona, owner: cell.owner, world, worlds };
        const values = cell.rule.fresh ? await cell.rule.fresh(context) : (cell.rule.ids?.(world, cell.owner) ?? {});
        cell.url = fillPattern(cell.pattern, values) + (cell.rule.query ?? "");
        const options = (await cell.rule.body?.(context)) ?? {};
        const response = await send(cell.persona.api, cell.method, cell.url, options);
        cell.status = response.status();
        if (cell.status >= 500 || (cell.expected === "deny" && !DENY_STATUSES.has(cell.status))) cell.text = (await response.text()).slice(0, 300);
      },
    );
  }

  const unexpectedAllows = cells.filter((c) => c.expected === "deny" && !DENY_STATUSES.has(c.status!));
  const unexpectedDenies = cells.filter((c) => c.expected === "allow" && DENY_STATUSES.has(c.status!));
  const serverErrors = cells.filter((c) => c.status! >= 500);
  // Without a live session, every protected route must say 401 (not 403/404, which would mean the cookie counted).
  const sessionless = cells.filter((c) => (c.persona.name === "anonymous" || c.persona.name === "deactivated" || c.persona.name === "shareHolder") && ["members", "reviewers", "admins"].includes(c.rule.who) && c.status !== 401);

  const describe = (c: Cell) => `${c.method} ${c.url} as ${c.persona.name} (owner ${c.owner}): ${c.status}${c.text ? ` ${c.text}` : ""}`;
  for (const c of unexpectedDenies) console.warn(`[authz] warning: unexpected deny ${describe(c)}`);
  for (const c of unexpectedAllows) console.error(`[authz] UNEXPECTED ALLOW ${describe(c)}`);
  for (const c of serverErrors) console.error(`[authz] server error ${describe(c)}`);
  console.log(`authorization matrix: ${cells.length} cells (${handlers.length} route handlers × ${personas.length} personas × id owners), ${unexpectedAllows.length} unexpected allows, ${unexpectedDenies.length} unexpected denies`);

  expect(unexpectedAllows.map(describe)).toEqual([]);
  expect(serverErrors.map(describe)).toEqual([]);
  expect(sessionless.map(describe)).toEqual([]);
});

test.describe("sign-in", () => {
  test("5 wrong passwords for one account give 429 with Retry-After; unknown e-mail and wrong password answer alike, in similar time", async ({ baseURL }) => {
    test.setTimeout(60_000);
    const admin = await apiAs(baseURL!, "admin");
    // A member of our own, so the lock-out does not touch anyone else's sign-in.
    const member = await createMember(admin, "installer", "ratelimit");
    const anon = await playwrightRequest.newContext({ baseURL });
    const attempt = async (email: string, password: string) => {
      const started = performance.now();
      const response = await anon.post("/api/auth/sign-in", { data: { email, password } });
      return { status: response.status(), body: await response.text(), ms: performance.now() - started, retryAfter: response.headers()["retry-after"] };
    };

    const unknown = await attempt(`${unique("nobody")}@security.test`, "some-wrong-password-1");
    const wrong = [];
    for (let i = 0; i < 5; i++) wrong.push(await attempt(member.email, `wrong-password-${i}-xyz`));
    expect(unknown.status).toBe(401);
    for (const w of wrong) {
      expect(w.status).toBe(401);
      expect(w.body).toBe(unknown.body);
    }
    expect(JSON.parse(unknown.body).error.message).toMatch(/e-mail and password/i);

    // Both paths compare a bcrypt hash, so neither answers fast and their times are alike.
    const wrongMs = wrong.map((w) => w.ms).sort((a, b) => a - b)[2]!;
    console.log(`sign-in timing: unknown e-mail ${unknown.ms.toFixed(0)} ms, wrong password (median) ${wrongMs.toFixed(0)} ms`);
    expect(unknown.ms).toBeGreaterThanOrEqual(50);
    expect(wrongMs).toBeGreaterThanOrEqual(50);
    expect(Math.max(unknown.ms, wrongMs) / Math.min(unknown.ms, wrongMs)).toBeLessThan(4);

    // The sixth try is refused before any hashing, even with the right password.
    const limited = await attempt(member.email, member.password);
    expect(limited.status).toBe(429);
    expect(Number(limited.retryAfter)).toBeGreaterThan(0);
    const error = JSON.parse(limited.body).error;
    expect(error.code).toBe("rate_limited");
    expect(error.message).toMatch(/too many failed sign-ins.*wait \d+ (seconds|minutes)/i);
  });

  test("a stranger's wrong passwords lock the account for unknown clients, not the member's own device", async ({ baseURL }) => {
    test.setTimeout(60_000);
    const admin = await apiAs(baseURL!, "admin");
    const member = await createMember(admin, "installer", "lockout");
    // Distant clients of their own (the e2e server trusts one proxy), so the loopback's count is untouched.
    const octet = () => 1 + Math.floor(Math.random() * 250);
    const from = async (address: string) => playwrightRequest.newContext({ baseURL, extraHTTPHeaders: { "X-Forwarded-For": address } });
    const device = await from(`203.0.113.${octet()}`);
    const first = await device.post("/api/auth/sign-in", { data: { email: member.email, password: member.password } });
    expect(first.status()).toBe(200);
    const deviceCookie = first.headersArray().find((h) => h.name.toLowerCase() === "set-cookie" && /flueward-device=/.test(h.value))?.value ?? "";
    expect(deviceCookie).toMatch(/HttpOnly/i);
    expect(deviceCookie).toMatch(/SameSite=Lax/i);
    expect(Number(/Max-Age=(\d+)/i.exec(deviceCookie)?.[1])).toBeGreaterThanOrEqual(180 * 24 * 3600);

    const attacker = await from(`198.51.100.${octet()}`);
    for (let i = 0; i < 5; i++) expect((await attacker.post("/api/auth/sign-in", { data: { email: member.email, password: `guess-${i}-wrong` } })).status()).toBe(401);
    const refused = await attacker.post("/api/auth/sign-in", { data: { email: member.email, password: member.password } });
    expect(refused.status()).toBe(429);
    expect(Number(refused.headers()["retry-after"])).toBeGreaterThan(0);
    const elsewhere = await from(`192.0.2.${octet()}`);
    expect((await elsewhere.post("/api/auth/sign-in", { data: { email: member.email, password: member.password } })).status()).toBe(429);
    // The device that signed in before still gets in.
    expect((await device.post("/api/auth/sign-in", { data: { email: member.email, password: member.password } })).status()).toBe(200);
  });

  test("a member on a temporary password can only change it: other APIs answer 403 password_change_required", async ({ baseURL }) => {
    const admin = await apiAs(baseURL!, "admin");
    const member = await createMember(admin, "admin", "temporary");
    const api = await signedIn(baseURL!, member.email, member.password);
    for (const [method, url] of [["get", "/api/jobs"], ["get", "/api/members"], ["post", "/api/jobs"], ["get", "/api/rulebooks"]] as const) {
      const response = method === "get" ? await api.get(url) : await api.post(url, { data: {} });
      expect(response.status(), url).toBe(403);
      expect((await response.json()).error.code, url).toBe("password_change_required");
    }
    const me = await api.get("/api/me");
    expect(me.status()).toBe(200);
    expect((await me.json()).member.mustChangePassword).toBe(true);
    const own = `${unique("own")} lantern meadow`;
    expect((await api.post("/api/auth/password", { data: { currentPassword: member.password, newPassword: own, confirmPassword: own } })).status()).toBe(200);
    expect((await api.get("/api/jobs")).status()).toBe(200);
  });

  test("the session id changes at every sign-in; the old cookie is refused, and after sign-out the last one too", async ({ baseURL }) => {
    const admin = await apiAs(baseURL!, "admin");
    const member = await createMember(admin, "installer", "session");
    const context = await playwrightRequest.newContext({ baseURL });
    const signIn = async () => expect((await context.post("/api/auth/sign-in", { data: { email: member.email, password: member.password } })).status()).toBe(200);

    await signIn();
    const first = cookieValue(await context.storageState());
    await signIn();
    const second = cookieValue(await context.storageState());
    expect(second.value).not.toBe(first.value);
    expect((await (await withCookie(baseURL!, first)).get("/api/me")).status()).toBe(401);
    expect((await (await withCookie(baseURL!, second)).get("/api/me")).status()).toBe(200);

    expect((await context.post("/api/auth/sign-out")).status()).toBe(200);
    expect((await (await withCookie(baseURL!, second)).get("/api/me")).status()).toBe(401);
  });

  test("password rules: length over composition, common and personal passwords refused", async ({ baseURL }) => {
    const admin = await apiAs(baseURL!, "admin");
    const member = await createMember(admin, "installer", "pwrules");
    const api = await signedIn(baseURL!, member.email, member.password);
    const change = async (newPassword: string) => {
      const response = await api.post("/api/auth/password", { data: { currentPassword: member.password, newPassword, confirmPassword: newPassword } });
      return { status: response.status(), body: await response.json() };
    };
    for (const [password, pattern] of [
      ["short-one", /at least 12/i],
      ["qwerty123456", /commonly used/i],
      [`${member.email.split("@")[0]}-x`, /e-mail address|name/i],
      ["a".repeat(80), /at most 72 bytes/i],
    ] as const) {
      const { status, body } = await change(password);
      expect(status, password).toBe(400);
      expect(JSON.stringify(body.error.fields), password).toMatch(pattern);
    }
    // Only letters, no digits or symbols: fine when long enough.
    expect((await change("marble lantern orchard")).status).toBe(200);
  });
});

test.describe("pages and APIs", () => {
  const scriptSourceOf = (csp: string) => csp.split(";").map((d) => d.trim()).find((d) => d.startsWith("script-src"))!;
  const expectPageHeaders = (url: string, headers: Record<string, string>) => {
    const csp = headers["content-security-policy"]!;
    const scriptSrc = scriptSourceOf(csp);
    expect(scriptSrc, url).not.toContain("'unsafe-inline'");
    expect(scriptSrc, url).not.toContain("'unsafe-eval'");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).toContain("object-src 'none'");
    expect(headers["x-content-type-options"]).toBe("nosniff");
    expect(headers["x-frame-options"]).toBe("DENY");
    expect(headers["referrer-policy"]).toBeTruthy();
    expect(headers["x-powered-by"]).toBeUndefined();
    return scriptSrc;
  };

  test("pages rendered per request carry a nonce CSP without 'unsafe-inline' for scripts, on every script tag", async ({ request, baseURL }) => {
    const member = await apiAs(baseURL!, "installer");
    for (const [url, client, status] of [["/verify", request, 200], ["/jobs", member, 200], ["/no/such/address", member, 404]] as const) {
      const response = await client.get(url);
      expect(response.status(), url).toBe(status);
      const scriptSrc = expectPageHeaders(url, response.headers());
      expect(scriptSrc).toMatch(/^script-src 'self' 'nonce-[A-Za-z0-9+/=]+' 'strict-dynamic'$/);
      const nonce = /'nonce-([^']+)'/.exec(scriptSrc)![1]!;
      const html = await response.text();
      const scripts = [...html.matchAll(/<script\b[^>]*>/g)].map((m) => m[0]);
      expect(scripts.length).toBeGreaterThan(0);
      for (const tag of scripts) expect(tag, `${url}: ${tag}`).toContain(`nonce="${nonce}"`);
    }
    await member.dispose();
    const api = await request.get("/api/health");
    expect(api.headers()["content-security-policy"]).toContain("default-src 'none'");
    expect(api.headers()["x-content-type-options"]).toBe("nosniff");
  });

  test("prerendered pages allow exactly their own inline scripts by hash, and script files only from this site", async ({ request }) => {
    for (const url of ["/sign-in", "/forbidden"]) {
      const response = await request.get(url);
      expect(response.status(), url).toBe(200);
      const scriptSrc = expectPageHeaders(url, response.headers());
      expect(scriptSrc).not.toContain("'nonce-");
      expect(scriptSrc).not.toContain("'strict-dynamic'");
      const allowed = new Set(scriptSrc.split(" ").slice(1));
      const html = await response.text();
      const scripts = [...html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/g)];
      const inline = scripts.filter((m) => !/\ssrc=/.test(` ${m[1]}`));
      expect(inline.length).toBeGreaterThan(0);
      for (const m of inline) expect(allowed, `${url}: ${m[2]!.slice(0, 60)}`).toContain(`'sha256-${createHash("sha256").update(m[2]!, "utf8").digest("base64")}'`);
      // Nothing else is allowed: one hash per distinct inline script, plus 'self'.
      expect(allowed.size).toBe(1 + new Set(inline.map((m) => m[2])).size);
      for (const m of scripts.filter((s) => /\ssrc=/.test(` ${s[1]}`))) expect(m[1], url).toMatch(/src="\/_next\//);
    }
  });

  test("cross-site state-changing requests are refused", async ({ baseURL }) => {
    const admin = await apiAs(baseURL!, "admin");
    const body = { customerName: `Security Test ${unique("csrf")}`, siteStreet: "3 Test Row", siteCity: "Testbury" };
    for (const headers of [{ Origin: "https://evil.example" }, { Origin: "null" }, { "Sec-Fetch-Site": "cross-site" }] as Record<string, string>[]) {
      const response = await admin.post("/api/jobs", { data: body, headers });
      expect(response.status(), JSON.stringify(headers)).toBe(403);
      expect((await response.json()).error.code).toBe("cross_site_refused");
    }
    const anon = await playwrightRequest.newContext({ baseURL });
    const signIn = await anon.post("/api/auth/sign-in", { data: { email: DEMO_ACCOUNTS.admin.email, password: DEMO_ACCOUNTS.admin.password }, headers: { Origin: "https://evil.example" } });
    expect(signIn.status()).toBe(403);
    expect((await anon.post("/api/auth/sign-out", { headers: { Origin: "https://evil.example" } })).status()).toBe(403);
    expect((await (await admin.get(`/api/jobs?q=${encodeURIComponent(body.customerName)}`)).json()).total).toBe(0);
  });

  test("no secret or server-only code reaches the browser bundle", async () => {
    const dir = path.join(process.cwd(), ".next/static");
    const files: string[] = [];
    const walk = (d: string) => {
      for (const entry of fs.readdirSync(d, { withFileTypes: true })) {
        const full = path.join(d, entry.name);
        if (entry.isDirectory()) walk(full);
        else if (/\.(js|mjs|css|json|map)$/.test(entry.name)) files.push(full);
      }
    };
    walk(dir);
    expect(files.length).toBeGreaterThan(0);
    const secretFile = path.join(process.cwd(), ".secrets/session-secret");
    const markers = [
      "password_hash",
      "better-sqlite3",
      "knex_migrations",
      "$2b$11$",
      "SESSION_SECRET",
      "SMTP_PASSWORD",
      "S3_SECRET_ACCESS_KEY",
      "BEGIN IMMEDIATE",
      ...Object.values(DEMO_ACCOUNTS).map((a) => a.password),
      ...(fs.existsSync(secretFile) ? [fs.readFileSync(secretFile, "utf8").trim()] : []),
      ...(process.env.SESSION_SECRET ? process.env.SESSION_SECRET.split(",") : []),
    ].filter((m) => m.length >= 6);
    const found: string[] = [];
    for (const file of files) {
      const text = fs.readFileSync(file, "utf8");
      for (const marker of markers) if (text.includes(marker)) found.push(`${path.relative(dir, file)} contains ${marker.length > 24 ? "a secret" : marker}`);
    }
    expect(found).toEqual([]);
  });
});

test.describe("uploads", () => {
  test("an HTML file named .jpg is refused; photos are served as JPEG with nosniff and a sandbox CSP; a PNG is re-encoded", async ({ baseURL }) => {
    const admin = await apiAs(baseURL!, "admin");
    const job = (await (await admin.post("/api/jobs", { data: { customerName: `Security Test ${unique("upload")}`, siteStreet: "4 Test Row", siteCity: "Testbury" } })).json()).job;
    const { id: inspectionId } = await (await admin.post(`/api/jobs/${job.id}/inspections`, { data: {} })).json();

    const html = Buffer.from("<!doctype html><html><body><script>alert(document.cookie)</script></body></html>");
    const refused = await admin.post(`/api/inspections/${inspectionId}/photos`, { multipart: { file: { name: "photo.jpg", mimeType: "image/jpeg", buffer: html } } });
    expect(refused.status()).toBeGreaterThanOrEqual(400);
    expect(refused.status()).toBeLessThan(500);
    expect((await refused.json()).error.message).toMatch(/not a photo/i);
    const svg = Buffer.from(`<svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"><rect width="10" height="10"/></svg>`);
    const svgRefused = await admin.post(`/api/inspections/${inspectionId}/photos`, { multipart: { file: { name: "photo.svg", mimeType: "image/svg+xml", buffer: svg } } });
    expect(svgRefused.status()).toBeGreaterThanOrEqual(400);
    expect(svgRefused.status()).toBeLessThan(500);
    expect((await (await admin.get(`/api/inspections/${inspectionId}/photos`)).json()).photos).toHaveLength(0);

    const { default: sharp } = await import("sharp");
    const png = await sharp({ create: { width: 40, height: 30, channels: 4, background: { r: 0, g: 120, b: 200, alpha: 1 } } }).png().toBuffer();
    const created = await admin.post(`/api/inspections/${inspectionId}/photos`, { multipart: { file: { name: "flue.png", mimeType: "image/png", buffer: png } } });
    expect(created.status()).toBe(201);
    const photo = (await created.json()).photo;
    for (const url of [photo.urls.full, photo.urls.thumb]) {
      const image = await admin.get(url);
      expect(image.status()).toBe(200);
      const headers = image.headers();
      expect(headers["content-type"]).toBe("image/jpeg");
      expect(headers["x-content-type-options"]).toBe("nosniff");
      expect(headers["content-security-policy"]).toMatch(/sandbox/);
      expect(headers["content-security-policy"]).toMatch(/default-src 'none'/);
      const bytes = await image.body();
      expect([bytes[0], bytes[1], bytes[2]]).toEqual([0xff, 0xd8, 0xff]);
    }

    const tooLarge = await admin.post(`/api/inspections/${inspectionId}/photos`, { multipart: { file: { name: "big.jpg", mimeType: "image/jpeg", buffer: Buffer.concat([await jpegBytes(), Buffer.alloc(17 * 1024 * 1024)]) } } });
    expect(tooLarge.status()).toBe(413);
  });
});
