import "server-only";
import { getDb } from "@/db/knex";
import { isRole, type Role } from "@/lib/auth/roles";

export interface UserCredentials {
  id: number;
  companyId: number;
  role: Role;
  active: boolean;
  passwordHash: string;
}

/** Credentials for sign-in. The only function that returns a password hash; callers never pass it on. */
export async function findCredentialsByEmail(email: string): Promise<UserCredentials | null> {
  const row = await getDb()("users").where({ email }).first("id", "company_id", "role", "active", "password_hash");
  if (!row || !isRole(row.role)) return null;
  return { id: row.id, companyId: row.company_id, role: row.role, active: Boolean(row.active), passwordHash: row.password_hash };
}

export async function findPasswordHash(args: { companyId: number; userId: number }): Promise<string | null> {
  const row = await getDb()("users").where({ id: args.userId, company_id: args.companyId }).first("password_hash");
  return row?.password_hash ?? null;
}
