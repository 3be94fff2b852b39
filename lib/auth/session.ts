import "server-only";
import { cache } from "react";
import { cookies } from "next/headers";
import { redirect } from "next/navigation";
import { getIronSession, unsealData, type SessionOptions } from "iron-session";
import { AppError } from "@/lib/errors";
import { can, type Permission, type Role } from "./roles";
import { sessionPasswords } from "./secret";
import {
  SESSION_ABSOLUTE_LIFETIME_MS,
  findSessionMember,
  type SessionMember,
} from "@/lib/data/sessions";

/** What the sealed cookie holds: only the random session id, checked against the sessions table. */
export interface SessionData {
  sid?: string;
}

export type Member = SessionMember;

/** Whether cookies carry Secure: COOKIE_SECURE, or by default only in production. */
export function secureCookies(): boolean {
  if (process.env.COOKIE_SECURE === "false") return false;
  if (process.env.COOKIE_SECURE === "true") return true;
  return process.env.NODE_ENV === "production";
}

export function sessionOptions(): SessionOptions {
  const secure = secureCookies();
  return {
    password: sessionPasswords(),
    // __Host- requires Secure, Path=/ and no Domain: the cookie cannot be set by a sibling subdomain.
    cookieName: secure ? "__Host-flueward-session" : "flueward-session",
    ttl: Math.floor(SESSION_ABSOLUTE_LIFETIME_MS / 1000),
    cookieOptions: { httpOnly: true, sameSite: "lax", secure, path: "/" },
  };
}

export async function getCookieSession() {
  return getIronSession<SessionData>(await cookies(), sessionOptions());
}

/**
 * Sealed cookie values already opened, with the session id inside, so a member's every request
 * does not repeat the key derivation and decryption. Only a cookie that unsealed is kept, keyed by
 * its exact value, for at most a minute; whether the session is still live is checked against the
 * sessions table on every request all the same. Bounded: the oldest entries go first.
 */
const UNSEALED_COOKIE_TTL_MS = 60_000;
const UNSEALED_COOKIE_LIMIT = 2_000;
const unsealedCookies = new Map<string, { sid: string; until: number }>();

async function sessionIdFromCookie(): Promise<string | undefined> {
  const options = sessionOptions();
  const sealed = (await cookies()).get(options.cookieName)?.value;
  if (!sealed) return undefined;
  const now = Date.now();
  const known = unsealedCookies.get(sealed);
  if (known && known.until > now) return known.sid;
  unsealedCookies.delete(sealed);
  const data = await unsealData<SessionData>(sealed, { password: options.password, ttl: options.ttl });
  if (typeof data.sid !== "string" || data.sid.length === 0) return undefined;
  unsealedCookies.set(sealed, { sid: data.sid, until: now + UNSEALED_COOKIE_TTL_MS });
  if (unsealedCookies.size > UNSEALED_COOKIE_LIMIT) unsealedCookies.delete(unsealedCookies.keys().next().value as string);
  return data.sid;
}

/** The signed-in member, or null. Memoised per request. */
export const getCurrentMember = cache(async (): Promise<Member | null> => {
  const sid = await sessionIdFromCookie();
  if (!sid) return null;
  return findSessionMember(sid);
});

/**
 * For route handlers and server actions: the member, or a 401 error. A member still on a
 * temporary password gets 403 `password_change_required` everywhere except the few routes that
 * pass `allowTemporaryPassword` (changing the password, reading who is signed in); since
 * `requireRole` and `requirePermission` come through here too, a new route is covered by default.
 */
export async function requireMember(options: { allowTemporaryPassword?: boolean } = {}): Promise<Member> {
  const member = await getCurrentMember();
  if (!member) throw new AppError("unauthenticated");
  if (member.mustChangePassword && !options.allowTemporaryPassword) throw new AppError("password_change_required");
  return member;
}

/** For route handlers and server actions: a member holding one of the roles, or 401/403. */
export async function requireRole(...roles: Role[]): Promise<Member> {
  const member = await requireMember();
  if (!roles.includes(member.role)) throw new AppError("forbidden");
  return member;
}

export async function requirePermission(permission: Permission): Promise<Member> {
  const member = await requireMember();
  if (!can(member.role, permission)) throw new AppError("forbidden");
  return member;
}

/** For pages: the member, or a redirect to sign-in (and to the password page after a temporary password). */
export async function requirePageMember(options: { allowPasswordChange?: boolean } = {}): Promise<Member> {
  const member = await getCurrentMember();
  if (!member) redirect("/sign-in");
  if (member.mustChangePassword && !options.allowPasswordChange) redirect("/account?first=1");
  return member;
}

/** For pages: a member with the permission; others see the forbidden page. */
export async function requirePagePermission(permission: Permission): Promise<Member> {
  const member = await requirePageMember();
  if (!can(member.role, permission)) redirect("/forbidden");
  return member;
}
