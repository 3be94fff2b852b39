import { describe, expect, test, vi } from "vitest";

vi.mock("next/headers", () => ({ cookies: async () => ({}) }));
vi.mock("@/db/knex", () => ({ getDb: () => { throw new Error("no database in this test"); } }));

const { retryAfterSeconds, SIGN_IN_MAX_FAILURES_PER_ACCOUNT } = await import("@/lib/auth/sign-in");

const at = (ms: number) => new Date(ms).toISOString();

describe("sign-in back-off", () => {
  const now = Date.parse("2026-12-01T12:00:00Z");
  test("no wait below the limit", () => {
    expect(retryAfterSeconds([at(now - 1000), at(now - 500)], SIGN_IN_MAX_FAILURES_PER_ACCOUNT, now)).toBe(0);
  });
  test("at the limit the wait starts at 30 s from the last failure", () => {
    const five = [4, 3, 2, 1, 0].map((i) => at(now - 10_000 - i)); // last failure 10 s ago
    expect(retryAfterSeconds(five, 5, now)).toBe(20);
  });
  test("each further failure doubles the wait, capped at the 15-minute window", () => {
    const last = now - 1000;
    const make = (n: number) => Array.from({ length: n }, () => at(last));
    expect(retryAfterSeconds(make(6), 5, now)).toBe(59);
    expect(retryAfterSeconds(make(7), 5, now)).toBe(119);
    expect(retryAfterSeconds(make(20), 5, now)).toBe(899);
  });
  test("the wait is over once enough time has passed", () => {
    expect(retryAfterSeconds(Array.from({ length: 5 }, () => at(now - 31_000)), 5, now)).toBe(0);
  });
});
