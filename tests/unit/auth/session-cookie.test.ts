import { beforeEach, describe, expect, test, vi } from "vitest";
import { sealData } from "iron-session";

/**
 * Reading the session cookie: a sealed cookie opens to its session id (kept for a minute so the
 * next requests skip the decryption), a forged or foreign-key cookie opens to nothing, and the
 * sessions table still decides on every request, so a revoked session ends at once.
 */
const cookieJar = new Map<string, string>();
vi.mock("next/headers", () => ({
  cookies: async () => ({ get: (name: string) => (cookieJar.has(name) ? { name, value: cookieJar.get(name)! } : undefined) }),
}));
const liveSessions = new Set<string>();
const lookups: string[] = [];
vi.mock("@/lib/data/sessions", () => ({
  SESSION_ABSOLUTE_LIFETIME_MS: 7 * 24 * 60 * 60 * 1000,
  findSessionMember: async (sid: string) => {
    lookups.push(sid);
    return liveSessions.has(sid) ? { sessionIdHash: `hash-${sid}`, userId: 7, companyId: 1, companyName: "Test Co", role: "installer", name: "Test Installer", email: "t@example.test", mustChangePassword: false } : null;
  },
}));

let unseals = 0;
vi.mock("iron-session", async (importOriginal) => {
  const actual = await importOriginal<typeof import("iron-session")>();
  return { ...actual, unsealData: (...args: Parameters<typeof actual.unsealData>) => ((unseals += 1), actual.unsealData(...args)) };
});

const SECRET = "a-test-session-secret-that-is-long-enough-0123456789";
process.env.SESSION_SECRET = SECRET;
process.env.COOKIE_SECURE = "false";
const { getCurrentMember, sessionOptions } = await import("@/lib/auth/session");

async function setCookie(sid: string, password = SECRET) {
  const options = sessionOptions();
  cookieJar.set(options.cookieName, await sealData({ sid }, { password: { "1": password }, ttl: options.ttl }));
}

describe("the session cookie", () => {
  beforeEach(() => {
    cookieJar.clear();
    liveSessions.clear();
    lookups.length = 0;
    unseals = 0;
  });

  test("no cookie: nobody is signed in, and the database is not asked", async () => {
    expect(await getCurrentMember()).toBeNull();
    expect(lookups).toEqual([]);
  });

  test("a sealed cookie opens to its session id, the same on the next request", async () => {
    liveSessions.add("sid-one");
    await setCookie("sid-one");
    expect((await getCurrentMember())?.userId).toBe(7);
    expect((await getCurrentMember())?.userId).toBe(7);
    expect(lookups).toEqual(["sid-one", "sid-one"]);
    expect(unseals).toBe(1); // the second request reused the opened cookie
  });

  test("a revoked session ends at once, although its cookie was opened before", async () => {
    liveSessions.add("sid-two");
    await setCookie("sid-two");
    expect(await getCurrentMember()).not.toBeNull();
    liveSessions.delete("sid-two");
    expect(await getCurrentMember()).toBeNull();
  });

  test("a cookie sealed with another secret, or altered, opens to nothing", async () => {
    liveSessions.add("sid-three");
    await setCookie("sid-three", "some-other-secret-that-is-also-long-enough-987654");
    expect(await getCurrentMember()).toBeNull();
    await setCookie("sid-three");
    const name = sessionOptions().cookieName;
    const sealed = cookieJar.get(name)!;
    const flipped = sealed.slice(0, 40) + (sealed[40] === "A" ? "B" : "A") + sealed.slice(41);
    cookieJar.set(name, flipped);
    expect(await getCurrentMember()).toBeNull();
    expect(lookups).toEqual([]);
  });
});
