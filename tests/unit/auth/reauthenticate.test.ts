import type { Knex } from "knex";
import { afterAll, beforeAll, describe, expect, test, vi } from "vitest";
import { createTestDatabase, insertCompany } from "@/tests/fixtures/test-db";
import { fakeHash, fakeVerifyPassword, insertUser } from "@/tests/fixtures/auth-world";
import type { Member } from "@/lib/auth/session";

/**
 * Typing the password again while signed in (approving, changing the password) is limited like
 * sign-in: 5 failures per member and 20 per client address within 15 minutes, then 429 with
 * Retry-After (the product's own limits, lib/auth/reauthenticate.ts); every wrong password is in
 * the audit trail.
 */
vi.mock("next/headers", () => ({ cookies: async () => ({ get: () => undefined }) }));
vi.mock("@/lib/auth/passwords", () => ({ verifyPassword: fakeVerifyPassword, hashPassword: async (p: string) => fakeHash(p) }));
vi.mock("@/lib/auth/common-passwords", () => ({ commonPasswords: async () => new Set<string>() }));

process.env.SESSION_SECRET = "a-test-session-secret-that-is-long-enough-0123456789";

let db: Knex;
let cleanup: () => Promise<void>;
let reauth: typeof import("@/lib/auth/reauthenticate");
let changeOwnPassword: typeof import("@/lib/auth/change-password").changeOwnPassword;
let companyId: number;
const PASSWORD = "right-password-for-tests";

beforeAll(async () => {
  const test = await createTestDatabase();
  db = test.db;
  cleanup = test.cleanup;
  process.env.FLUEWARD_DB_FILE = test.file;
  reauth = await import("@/lib/auth/reauthenticate");
  ({ changeOwnPassword } = await import("@/lib/auth/change-password"));
  companyId = await insertCompany(db, "Test Heating");
});

afterAll(async () => {
  const { getDb } = await import("@/db/knex");
  await getDb().destroy();
  await cleanup();
});

async function newMember(email: string, role: Member["role"] = "supervisor"): Promise<Member> {
  const userId = await insertUser(db, { companyId, email, password: PASSWORD, role, name: `Member ${email}` });
  return { sessionIdHash: `session-of-${email}`, userId, companyId, companyName: "Test Heating", role, name: `Member ${email}`, email, mustChangePassword: false };
}

async function approveWith(member: Member, password: string, client = "203.0.113.5") {
  try {
    await reauth.confirmOwnPassword({ member, password, client, purpose: { kind: "approve", inspectionId: 77 }, field: "password", wrongMessage: "That is not your password." });
    return { status: 200, fields: undefined as Record<string, string> | undefined, retryAfter: undefined as string | undefined };
  } catch (error) {
    const e = error as { status: number; fields?: Record<string, string>; headers?: Record<string, string> };
    return { status: e.status, fields: e.fields, retryAfter: e.headers?.["Retry-After"] };
  }
}

const failuresAudited = async (userId: number) =>
  db("audit_events").where({ entity_type: "user", entity_id: userId, action: "session.password_reentry_failed" }).orderBy("id").select("summary", "actor_user_id", "after_json");

describe("password re-entry", () => {
  test("five wrong passwords when approving pause the member with 429 and Retry-After; each one is audited", async () => {
    const member = await newMember("approver@reauth.test");
    for (let i = 0; i < 5; i++) {
      const wrong = await approveWith(member, `wrong-${i}`);
      expect(wrong.status).toBe(400);
      expect(wrong.fields).toEqual({ password: "That is not your password." });
    }
    const paused = await approveWith(member, PASSWORD);
    expect(paused.status).toBe(429);
    expect(Number(paused.retryAfter)).toBeGreaterThan(0);

    const audited = await failuresAudited(member.userId);
    expect(audited).toHaveLength(5);
    expect(audited[0].actor_user_id).toBe(member.userId);
    expect(audited[0].summary).toMatch(/wrong password when approving inspection 77/);
    expect(JSON.parse(audited[0].after_json)).toEqual({ client: "203.0.113.5" });
  });

  test("a right password clears the member's count; another member is not held by it", async () => {
    const member = await newMember("steady@reauth.test");
    for (let i = 0; i < 4; i++) expect((await approveWith(member, `wrong-${i}`)).status).toBe(400);
    expect((await approveWith(member, PASSWORD)).status).toBe(200);
    for (let i = 0; i < 4; i++) expect((await approveWith(member, `wrong-again-${i}`)).status).toBe(400);
    expect((await approveWith(member, PASSWORD)).status).toBe(200);
    expect(await failuresAudited(member.userId)).toHaveLength(8);
  });

  test("a wrong current password when changing it counts and is audited the same way", async () => {
    const member = await newMember("changer@reauth.test", "installer");
    const change = async (currentPassword: string) => {
      try {
        await changeOwnPassword({ member, currentPassword, newPassword: "lichen-orbit-tallow-9", client: "203.0.113.9" });
        return { status: 200, fields: undefined as Record<string, string> | undefined };
      } catch (error) {
        const e = error as { status: number; fields?: Record<string, string> };
        return { status: e.status, fields: e.fields };
      }
    };
    for (let i = 0; i < 5; i++) expect(await change(`wrong-${i}`)).toEqual({ status: 400, fields: { currentPassword: "That is not your current password." } });
    expect((await change(PASSWORD)).status).toBe(429);
    const audited = await failuresAudited(member.userId);
    expect(audited).toHaveLength(5);
    expect(audited[4].summary).toMatch(/wrong password when changing their password/);
    // Nothing changed: the stored password is still the old one.
    expect((await db("users").where({ id: member.userId }).first("password_hash")).password_hash).toBe(fakeHash(PASSWORD));
  });

  test("one client failing for many members is stopped by the per-client limit; another client is not", async () => {
    const members = await Promise.all([0, 1, 2, 3, 4].map((i) => newMember(`crowd-${i}@reauth.test`)));
    for (const member of members) for (let i = 0; i < 4; i++) expect((await approveWith(member, `wrong-${i}`, "198.51.100.40")).status).toBe(400);
    const fresh = await newMember("fresh@reauth.test");
    expect((await approveWith(fresh, PASSWORD, "198.51.100.40")).status).toBe(429);
    expect((await approveWith(fresh, PASSWORD, "198.51.100.41")).status).toBe(200);
  });

  test("re-entry failures and sign-in failures are counted apart", async () => {
    const member = await newMember("apart@reauth.test");
    const now = new Date().toISOString();
    // A stranger's five failed sign-ins for this account, from unknown clients.
    await db("login_attempts").insert(Array.from({ length: 5 }, () => ({ email: member.email, client: "198.51.100.60", succeeded: false, purpose: "sign_in", created_at: now })));
    expect((await approveWith(member, PASSWORD)).status).toBe(200);
  });
});
