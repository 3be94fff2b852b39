import { can, type Permission, type Role } from "@/lib/auth/roles";

export interface NavItem {
  href: string;
  label: string;
  icon: "jobs" | "rulebooks" | "members" | "account" | "review";
  permission: Permission | null;
}

/** Everything the shell can link to; each role sees only what its permissions allow. */
export const NAV_ITEMS: readonly NavItem[] = [
  { href: "/jobs", label: "Jobs", icon: "jobs", permission: "jobs.read" },
  { href: "/rulebooks", label: "Rulebooks", icon: "rulebooks", permission: "rulebooks.read" },
  { href: "/members", label: "Members", icon: "members", permission: "members.manage" },
  { href: "/settings/site-checks", label: "Site checks", icon: "review", permission: "site_checks.manage" },
  { href: "/account", label: "Account", icon: "account", permission: null },
];

export function navItemsFor(role: Role): NavItem[] {
  return NAV_ITEMS.filter((item) => item.permission === null || can(role, item.permission));
}
