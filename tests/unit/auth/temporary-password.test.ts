import fs from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, test, vi } from "vitest";
import { sealData } from "iron-session";
import { NextRequest } from "next/server";

/**
 * A member still on the temporary password an admin gave them can do nothing through the API but
 * change it: every route handler under app/api answers 403 `password_change_required`, except
 * changing the password, signing out, reading who is signed in, and the routes that need no
 * session at all. Found by walking the folder, so a new route is checked without being listed.
 */
const cookieJar = new Map<string, string>();
vi.mock("next/headers", () => ({
  cookies: async () => ({
    get: (name: string) => (cookieJar.has(name) ? { name, value: cookieJar.get(name)! } : undefined),
    set: () => {},
    delete: () => {},
    has: (name: string) => cookieJar.has(name),
    getAll: () => [...cookieJar].map(([name, value]) => ({ name, value })),
  }),
  headers: async () => new Headers(),
}));
let mustChangePassword = true;
vi.mock("@/lib/data/sessions", () => ({
  SESSION_ABSOLUTE_LIFETIME_MS: 7 * 24 * 60 * 60 * 1000,
  findSessionMember: async () => ({ sessionIdHash: "hash-temp", userId: 7, companyId: 1, companyName: "Test Co", role: "admin", name: "Temp Admin", email: "temp@example.test", mustChangePassword }),
  hashSessionId: (sid: string) => `hash-${sid}`,
  revokeSession: async () => {},
}));
// Reached only by the routes a temporary password may use; kept away from any database.
vi.mock("@/lib/auth/change-password", () => ({ changeOwnPassword: async () => {} }));

process.env.SESSION_SECRET = "a-test-session-secret-that-is-long-enough-0123456789";
process.env.COOKIE_SECURE = "false";

const API_DIR = path.resolve(__dirname, "../../../app/api");
/** Routes a member on a temporary password may use. */
const ALLOWED = new Set(["POST /api/auth/password", "POST /api/auth/sign-out", "GET /api/me"]);
/** Routes that need no session, so a temporary password changes nothing for them. */
const PUBLIC = new Set(["POST /api/auth/sign-in", "GET /api/health", "POST /api/verify", "GET /api/verify", "GET /api/bench/ping"]);
const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;

function routeFiles(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) return routeFiles(full);
    return entry.name === "route.ts" ? [full] : [];
  });
}

function urlPath(file: string): string {
  return "/api/" + path.relative(API_DIR, path.dirname(file)).split(path.sep).join("/");
}

type Handler = (request: NextRequest, context: { params: Promise<Record<string, string>> }) => Promise<Response>;

async function call(handler: Handler, method: string, pathname: string) {
  const address = `http://localhost${pathname.replace(/\[[^\]]+\]/g, "1")}`;
  const request = new NextRequest(address, {
    method,
    headers: { host: "localhost", origin: "http://localhost", "content-type": "application/json" },
    body: method === "GET" || method === "DELETE" ? undefined : "{}",
  });
  const response = await handler(request, { params: Promise.resolve({ id: "1", version: "1", table: "appliance_categories", token: "x" }) });
  const text = await response.text();
  let code: string | undefined;
  try {
    code = JSON.parse(text)?.error?.code;
  } catch {
    code = undefined;
  }
  return { status: response.status, code };
}

beforeAll(async () => {
  const { sessionOptions } = await import("@/lib/auth/session");
  const options = sessionOptions();
  cookieJar.set(options.cookieName, await sealData({ sid: "temp-sid" }, { password: options.password, ttl: options.ttl }));
});

describe("a member on a temporary password", () => {
  const files = routeFiles(API_DIR);

  test("the walk finds the routes, and every route it leaves out is one that exists", async () => {
    expect(files.length).toBeGreaterThan(30);
    const keys = new Set<string>();
    for (const file of files) {
      const mod = (await import(file)) as Record<string, unknown>;
      for (const method of METHODS) if (typeof mod[method] === "function") keys.add(`${method} ${urlPath(file)}`);
    }
    for (const key of [...ALLOWED, ...PUBLIC]) expect(keys, key).toContain(key);
  }, 120_000);

  test("gets 403 password_change_required from every other API route", async () => {
    mustChangePassword = true;
    const refused: string[] = [];
    const others: string[] = [];
    for (const file of files) {
      const mod = (await import(file)) as Partial<Record<(typeof METHODS)[number], Handler>>;
      for (const method of METHODS) {
        const handler = mod[method];
        if (!handler) continue;
        const key = `${method} ${urlPath(file)}`;
        if (ALLOWED.has(key) || PUBLIC.has(key)) continue;
        const { status, code } = await call(handler, method, urlPath(file));
        if (status === 403 && code === "password_change_required") refused.push(key);
        else others.push(`${key} → ${status} ${code}`);
      }
    }
    expect(others).toEqual([]);
    // A sample the product depends on, named so a broken walk cannot pass by finding nothing.
    for (const key of ["GET /api/jobs", "POST /api/jobs", "GET /api/inspections/[id]", "POST /api/inspections/[id]/approve", "PATCH /api/members/[id]", "POST /api/members", "GET /api/records/[id]/pdf", "POST /api/check"]) {
      expect(refused).toContain(key);
    }
  }, 120_000);

  test("may still change the password, sign out and read who is signed in", async () => {
    mustChangePassword = true;
    const me = await import("@/app/api/me/route");
    const meAnswer = await me.GET(new NextRequest("http://localhost/api/me"), { params: Promise.resolve({}) });
    expect(meAnswer.status).toBe(200);
    expect((await meAnswer.json()).member.mustChangePassword).toBe(true);

    const password = await import("@/app/api/auth/password/route");
    const body = JSON.stringify({ currentPassword: "temporary-one", newPassword: "saltmarsh kettle orbit", confirmPassword: "saltmarsh kettle orbit" });
    const changed = await password.POST(
      new NextRequest("http://localhost/api/auth/password", { method: "POST", headers: { host: "localhost", origin: "http://localhost", "content-type": "application/json" }, body }),
      { params: Promise.resolve({}) },
    );
    expect(changed.status).toBe(200);

    const signOut = await import("@/app/api/auth/sign-out/route");
    const out = await signOut.POST(new NextRequest("http://localhost/api/auth/sign-out", { method: "POST", headers: { host: "localhost", origin: "http://localhost" } }), { params: Promise.resolve({}) });
    expect(out.status).toBe(200);
  });

  test("once the password is changed, the same routes answer as usual (no longer 403 password_change_required)", async () => {
    mustChangePassword = false;
    const jobs = await import("@/app/api/members/[id]/route");
    const { status, code } = await call(jobs.PATCH as unknown as Handler, "PATCH", "/api/members/[id]");
    expect(code).not.toBe("password_change_required");
    expect(status).toBe(400); // the empty body now reaches the schema
  });
});
