import { describe, expect, test } from "vitest";
import { dictionary } from "@zxcvbn-ts/language-common";
import { PASSWORD_MESSAGES, passwordProblem } from "@/lib/auth/password-policy";

// Length over composition, no forced character classes, refuse known-common passwords:
// the memorized-secret rules of NIST SP 800-63B section 5.1.1 (minimum 8; we require 12).
const common = new Set((dictionary as { passwords: string[] }).passwords.map((p) => p.toLowerCase()));

describe("password rules", () => {
  test.each([
    ["short", "short-pass", PASSWORD_MESSAGES.tooShort],
    ["exactly 11 characters", "abcdefghijk", PASSWORD_MESSAGES.tooShort],
    ["a common password of 12+ characters", "password1234", PASSWORD_MESSAGES.common],
    ["one repeated character", "aaaaaaaaaaaaaa", PASSWORD_MESSAGES.repeated],
    ["a simple sequence", "123456789012", PASSWORD_MESSAGES.repeated],
    ["contains the e-mail name", "tamsin.wexley-2026!", PASSWORD_MESSAGES.context],
    ["over bcrypt's 72 bytes", "ü".repeat(40), PASSWORD_MESSAGES.tooLong],
  ])("refuses %s", (_name, password, message) => {
    expect(passwordProblem(password, { email: "tamsin.wexley@flueward.test", name: "Tamsin Wexley", commonPasswords: common })).toBe(message);
  });

  test.each([["exactly 12 characters", "kettle-orbit"], ["words with spaces", "saltmarsh kettle orbit"], ["no symbols or digits needed", "lanterncopperheron"]])(
    "accepts %s",
    (_name, password) => {
      expect(passwordProblem(password, { email: "tamsin.wexley@flueward.test", commonPasswords: common })).toBeNull();
    },
  );

  test("the shipped common-password list is substantial", () => {
    expect(common.size).toBeGreaterThan(10_000);
    expect(common.has("password")).toBe(true);
  });
});
