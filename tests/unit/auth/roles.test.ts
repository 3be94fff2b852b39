import { describe, expect, test } from "vitest";
import { PERMISSIONS, ROLES, can } from "@/lib/auth/roles";
import { navItemsFor } from "@/components/app-shell/nav-items";

describe("roles and permissions", () => {
  test("only admins manage members and company details", () => {
    expect(ROLES.filter((r) => can(r, "members.manage"))).toEqual(["admin"]);
    expect(ROLES.filter((r) => can(r, "company.manage"))).toEqual(["admin"]);
  });

  test("supervisors and admins edit rulebooks and assign jobs; every role reads jobs", () => {
    expect(ROLES.filter((r) => can(r, "rulebooks.write"))).toEqual(["supervisor", "admin"]);
    expect(ROLES.filter((r) => can(r, "jobs.assign"))).toEqual(["supervisor", "admin"]);
    expect(ROLES.every((r) => can(r, "jobs.read"))).toBe(true);
  });

  test("navigation never links a role to a page its permissions refuse", () => {
    for (const role of ROLES) {
      for (const item of navItemsFor(role)) {
        if (item.permission) expect(can(role, item.permission), `${role} → ${item.href}`).toBe(true);
      }
    }
    expect(navItemsFor("installer").map((i) => i.href)).not.toContain("/members");
  });

  test("every permission lists known roles only", () => {
    for (const roles of Object.values(PERMISSIONS)) for (const role of roles) expect(ROLES).toContain(role);
  });
});
