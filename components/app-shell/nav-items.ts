import { can, type Permission, type Role } from "@/lib/auth/roles";

export interface NavItem {
  href: string;
  label: string;
  icon: "jobs" | "rulebooks" | "members" | "account" | "review";
  permission: Permission | null;
  /** Shown in the phone's bottom bar too (setup pages stay on the desktop sidebar and the account page). */
  phone: boolean;
}

/** Everything the shell can link to; each role sees only what its permissions allow. */
export const NAV_ITEMS: readonly NavItem[] = [
  { href: "/jobs", label: "Jobs", icon: "jobs", permission: "jobs.read", phone: true },
  { href: "/review", label: "Review", icon: "review", permission: "inspections.review", phone: true },
  { href: "/rulebooks", label: "Rulebooks", icon: "rulebooks", permission: "rulebooks.read", phone: true },
  { href: "/members", label: "Members", icon: "members", permission: "members.manage", phone: true },
  { href: "/settings/site-checks", label: "Site checks", icon: "review", permission: "site_checks.manage", phone: false },
  { href: "/account", label: "Account", icon: "account", permission: null, phone: true },
];

export function navItemsFor(role: Role): NavItem[] {
  return NAV_ITEMS.filter((item) => item.permission === null || can(role, item.permission));
}
