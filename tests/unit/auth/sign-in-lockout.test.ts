import type { Knex } from "knex";
import { afterAll, beforeAll, describe, expect, test, vi } from "vitest";
import { createTestDatabase, insertCompany } from "@/tests/fixtures/test-db";
import { CookieJar, fakeVerifyPassword, insertUser } from "@/tests/fixtures/auth-world";

/**
 * Sign-in limits against a live (SQLite) database: a stranger's wrong passwords slow down and then
 * block the account for unknown clients, while the member's own device (a valid device cookie for
 * the account) is judged only by its own count and still gets in. The limits (5 per account, 20 per
 * client, 5 per device within 15 minutes) are the product's own (lib/auth/sign-in.ts), in line with
 * common practice for online password guessing.
 */
let jar = new CookieJar();
vi.mock("next/headers", () => ({ cookies: async () => jar }));
vi.mock("@/lib/auth/passwords", () => ({ verifyPassword: fakeVerifyPassword }));
vi.mock("@/lib/auth/session", () => ({
  secureCookies: () => process.env.COOKIE_SECURE === "true",
  getCookieSession: async () => ({ sid: undefined as string | undefined, save: async () => {}, destroy: () => {} }),
}));

process.env.SESSION_SECRET = "a-test-session-secret-that-is-long-enough-0123456789";
process.env.COOKIE_SECURE = "false";

let db: Knex;
let cleanup: () => Promise<void>;
let signIn: typeof import("@/lib/auth/sign-in").signIn;
let device: typeof import("@/lib/auth/device-cookie");
let companyId: number;
const PASSWORD = "right-password-for-tests";

beforeAll(async () => {
  const test = await createTestDatabase();
  db = test.db;
  cleanup = test.cleanup;
  process.env.FLUEWARD_DB_FILE = test.file;
  ({ signIn } = await import("@/lib/auth/sign-in"));
  device = await import("@/lib/auth/device-cookie");
  companyId = await insertCompany(db, "Test Heating");
});

afterAll(async () => {
  const { getDb } = await import("@/db/knex");
  await getDb().destroy();
  await cleanup();
});

/** One browser at one address. */
function browser(client: string) {
  const own = new CookieJar();
  return {
    jar: own,
    attempt: async (email: string, password: string) => {
      jar = own;
      try {
        await signIn({ email, password, client, userAgent: "test" });
        return { status: 200, retryAfter: undefined as string | undefined, message: "" };
      } catch (error) {
        const e = error as { status?: number; headers?: Record<string, string>; message: string };
        return { status: e.status ?? 500, retryAfter: e.headers?.["Retry-After"], message: e.message };
      }
    },
  };
}

describe("a stranger cannot lock a member out", () => {
  test("an attacker with no device cookie locks the account for unknown clients, but the member's device still signs in", async () => {
    const email = "kept-in@lockout.test";
    await insertUser(db, { companyId, email, password: PASSWORD });
    const member = browser("203.0.113.5");
    expect((await member.attempt(email, PASSWORD)).status).toBe(200);
    expect(member.jar.has(device.deviceCookieName())).toBe(true);

    const attacker = browser("198.51.100.7");
    for (let i = 0; i < 5; i++) expect((await attacker.attempt(email, `guess-${i}`)).status).toBe(401);
    // The sixth try is refused before the password is even compared, right or wrong.
    const refused = await attacker.attempt(email, PASSWORD);
    expect(refused.status).toBe(429);
    expect(Number(refused.retryAfter)).toBeGreaterThan(0);
    expect(refused.message).toMatch(/wait \d+ seconds.*device you have signed in on before/i);

    // Any other unknown client is held by the same account lock, even with the right password.
    expect((await browser("192.0.2.9").attempt(email, PASSWORD)).status).toBe(429);

    // The member's own device is not: it signs in with the right password.
    expect((await member.attempt(email, PASSWORD)).status).toBe(200);
    // …and its success does not lift the stranger's lock for unknown clients.
    expect((await browser("192.0.2.10").attempt(email, PASSWORD)).status).toBe(429);
  });

  test("a known device has its own count: five wrong passwords on it pause that device only", async () => {
    const email = "own-count@lockout.test";
    await insertUser(db, { companyId, email, password: PASSWORD });
    const phone = browser("203.0.113.20");
    const laptop = browser("203.0.113.21");
    expect((await phone.attempt(email, PASSWORD)).status).toBe(200);
    expect((await laptop.attempt(email, PASSWORD)).status).toBe(200);

    for (let i = 0; i < 5; i++) expect((await phone.attempt(email, `typo-${i}`)).status).toBe(401);
    const paused = await phone.attempt(email, PASSWORD);
    expect(paused.status).toBe(429);
    expect(paused.message).toMatch(/on this device/);
    // The laptop and unknown clients were not counted against.
    expect((await laptop.attempt(email, PASSWORD)).status).toBe(200);
    expect((await browser("203.0.113.22").attempt(email, PASSWORD)).status).toBe(200);
  });

  test("a device cookie issued to another account, or altered, counts as an unknown client", async () => {
    const victim = "victim@lockout.test";
    const other = "other@lockout.test";
    await insertUser(db, { companyId, email: victim, password: PASSWORD });
    await insertUser(db, { companyId, email: other, password: PASSWORD });
    const attacker = browser("198.51.100.30");
    // The attacker holds a genuine device cookie, but for their own account.
    expect((await attacker.attempt(other, PASSWORD)).status).toBe(200);
    for (let i = 0; i < 5; i++) expect((await attacker.attempt(victim, `guess-${i}`)).status).toBe(401);
    expect((await attacker.attempt(victim, PASSWORD)).status).toBe(429);

  });

  test("a device cookie with one character changed is not the member's device", async () => {
    const email = "altered@lockout.test";
    await insertUser(db, { companyId, email, password: PASSWORD });
    const member = browser("203.0.113.31");
    expect((await member.attempt(email, PASSWORD)).status).toBe(200);
    const name = device.deviceCookieName();
    const genuine = member.jar.get(name)!.value;
    for (let i = 0; i < 5; i++) expect((await browser("198.51.100.33").attempt(email, `guess-${i}`)).status).toBe(401);

    const signatureStart = genuine.lastIndexOf(".") + 1;
    const flipped = genuine[signatureStart] === "A" ? "B" : "A";
    member.jar.set(name, genuine.slice(0, signatureStart) + flipped + genuine.slice(signatureStart + 1));
    expect((await member.attempt(email, PASSWORD)).status).toBe(429);
    member.jar.set(name, genuine);
    expect((await member.attempt(email, PASSWORD)).status).toBe(200);
  });

  test("one client guessing across many accounts is stopped by the per-client limit; other clients are not", async () => {
    const spray = browser("198.51.100.50");
    for (let i = 0; i < 20; i++) expect((await spray.attempt(`sprayed-${i}@lockout.test`, "Winter2026!")).status).toBe(401);
    expect((await spray.attempt("sprayed-21@lockout.test", "Winter2026!")).status).toBe(429);
    const email = "unaffected@lockout.test";
    await insertUser(db, { companyId, email, password: PASSWORD });
    expect((await browser("198.51.100.51").attempt(email, PASSWORD)).status).toBe(200);
  });
});

describe("the device cookie", () => {
  test("is httpOnly, SameSite=Lax, long-lived, Secure as COOKIE_SECURE says, and names the member", async () => {
    const email = "cookie@lockout.test";
    const id = await insertUser(db, { companyId, email, password: PASSWORD });
    const b = browser("203.0.113.60");
    expect((await b.attempt(email, PASSWORD)).status).toBe(200);
    const name = device.deviceCookieName();
    expect(name).toBe("flueward-device");
    const options = b.jar.options.get(name)!;
    expect(options).toMatchObject({ httpOnly: true, sameSite: "lax", secure: false, path: "/" });
    expect(options.maxAge as number).toBeGreaterThanOrEqual(180 * 24 * 60 * 60);
    const read = device.readDeviceCookie(b.jar.get(name)!.value);
    expect(read?.memberId).toBe(id);
    expect(Math.abs(Date.now() - read!.issuedAtMs)).toBeLessThan(60_000);

    process.env.COOKIE_SECURE = "true";
    try {
      expect(device.deviceCookieName()).toBe("__Host-flueward-device");
      expect(device.deviceCookieOptions().secure).toBe(true);
    } finally {
      process.env.COOKIE_SECURE = "false";
    }
  });

  test("expires after its lifetime, refuses an issue time in the future, and survives a secret rotation", () => {
    const now = Date.parse("2026-12-05T10:00:00Z");
    const { value } = device.issueDeviceCookie(42, now);
    expect(device.readDeviceCookie(value, now)?.memberId).toBe(42);
    expect(device.readDeviceCookie(value, now + device.DEVICE_COOKIE_LIFETIME_MS - 1000)).not.toBeNull();
    expect(device.readDeviceCookie(value, now + device.DEVICE_COOKIE_LIFETIME_MS + 1000)).toBeNull();
    expect(device.readDeviceCookie(value, now - 60 * 60 * 1000)).toBeNull();

    const original = process.env.SESSION_SECRET!;
    try {
      process.env.SESSION_SECRET = `a-newer-session-secret-that-is-long-enough-98765,${original}`;
      expect(device.readDeviceCookie(value, now)?.memberId).toBe(42);
      process.env.SESSION_SECRET = "a-newer-session-secret-that-is-long-enough-98765";
      expect(device.readDeviceCookie(value, now)).toBeNull();
    } finally {
      process.env.SESSION_SECRET = original;
    }
    for (const forged of ["", "v1.42", value.replace("v1.42.", "v1.43."), `${value}x`, value.replace(/^v1/, "v2")]) {
      expect(device.readDeviceCookie(forged, now)).toBeNull();
    }
  });
});
