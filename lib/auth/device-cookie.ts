import "server-only";
import crypto from "node:crypto";
import { sessionPasswords } from "./secret";
import { secureCookies } from "./session";

/**
 * The device cookie: proof that this browser once signed in as a member. A sign-in attempt that
 * carries a valid one for the account it names is judged by that device's own failure count, so a
 * stranger guessing the member's password from elsewhere cannot lock the member out of their own
 * device (lib/auth/sign-in.ts).
 *
 * Value: `v1.<member id>.<issued at, ms>.<device id>.<HMAC-SHA256>`, signed with a key derived
 * from the session secret (the newest one; any configured secret still verifies, so rotating
 * SESSION_SECRET does not forget devices at once). It grants nothing by itself: the password is
 * still checked.
 */
export const DEVICE_COOKIE_LIFETIME_MS = 365 * 24 * 60 * 60 * 1000;
/** Clocks of several servers may differ a little; an issue time further ahead than this is forged. */
const CLOCK_SKEW_MS = 5 * 60 * 1000;
const VERSION = "v1";

export interface DeviceCookie {
  memberId: number;
  issuedAtMs: number;
  /** Random, per issued cookie: the key of the device's own failure count. */
  deviceId: string;
}

export function deviceCookieName(): string {
  // __Host- requires Secure, Path=/ and no Domain, as the session cookie's name does.
  return secureCookies() ? "__Host-flueward-device" : "flueward-device";
}

export function deviceCookieOptions() {
  return {
    httpOnly: true,
    secure: secureCookies(),
    sameSite: "lax" as const,
    path: "/",
    maxAge: Math.floor(DEVICE_COOKIE_LIFETIME_MS / 1000),
  };
}

function signingKeys(): Buffer[] {
  const passwords = sessionPasswords();
  return Object.keys(passwords)
    .sort((a, b) => Number(b) - Number(a))
    .map((id) => crypto.createHmac("sha256", passwords[id]!).update("flueward device cookie").digest());
}

function signature(key: Buffer, payload: string): Buffer {
  return crypto.createHmac("sha256", key).update(payload).digest();
}

/** A fresh device cookie value for the member, signed with the newest secret. */
export function issueDeviceCookie(memberId: number, nowMs: number = Date.now()): { value: string; cookie: DeviceCookie } {
  const cookie: DeviceCookie = { memberId, issuedAtMs: nowMs, deviceId: crypto.randomBytes(16).toString("base64url") };
  const payload = `${VERSION}.${cookie.memberId}.${cookie.issuedAtMs}.${cookie.deviceId}`;
  return { value: `${payload}.${signature(signingKeys()[0]!, payload).toString("base64url")}`, cookie };
}

/** The cookie's content when its signature holds and it has not expired; otherwise null. */
export function readDeviceCookie(value: string | undefined, nowMs: number = Date.now()): DeviceCookie | null {
  if (!value || value.length > 200) return null;
  const parts = value.split(".");
  if (parts.length !== 5 || parts[0] !== VERSION) return null;
  const [, memberText, issuedText, deviceId, signatureText] = parts as [string, string, string, string, string];
  if (!/^[1-9]\d{0,9}$/.test(memberText) || !/^\d{1,15}$/.test(issuedText) || !/^[A-Za-z0-9_-]{22}$/.test(deviceId)) return null;
  const given = Buffer.from(signatureText, "base64url");
  if (given.length !== 32) return null;
  const payload = parts.slice(0, 4).join(".");
  if (!signingKeys().some((key) => crypto.timingSafeEqual(signature(key, payload), given))) return null;
  const issuedAtMs = Number(issuedText);
  if (issuedAtMs > nowMs + CLOCK_SKEW_MS || nowMs - issuedAtMs > DEVICE_COOKIE_LIFETIME_MS) return null;
  return { memberId: Number(memberText), issuedAtMs, deviceId };
}
