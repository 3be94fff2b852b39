/**
 * Roles and what each may do. Pure: used by the server to authorise and by the UI to decide
 * what to show (the UI never decides alone).
 */
export const ROLES = ["installer", "supervisor", "admin"] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS = {
  installer: "Installer",
  supervisor: "Supervisor",
  admin: "Admin",
} as const satisfies Record<Role, string>;

export const PERMISSIONS = {
  "jobs.read": ["installer", "supervisor", "admin"],
  "jobs.write": ["installer", "supervisor", "admin"],
  "jobs.assign": ["supervisor", "admin"],
  "rulebooks.read": ["installer", "supervisor", "admin"],
  "rulebooks.write": ["supervisor", "admin"],
  "members.manage": ["admin"],
  "company.manage": ["admin"],
  "audit.read": ["supervisor", "admin"],
  "inspections.review": ["supervisor", "admin"],
  "records.share": ["supervisor", "admin"],
  "records.revoke": ["supervisor", "admin"],
  "site_checks.manage": ["admin"],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof PERMISSIONS;

export function can(role: Role, permission: Permission): boolean {
  return (PERMISSIONS[permission] as readonly Role[]).includes(role);
}

export function isRole(value: unknown): value is Role {
  return typeof value === "string" && (ROLES as readonly string[]).includes(value);
}
