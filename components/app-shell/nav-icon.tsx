import type { NavItem } from "./nav-items";

const PATHS: Record<NavItem["icon"], string> = {
  jobs: "M4 7h16v12H4zM9 7V5h6v2M4 12h16",
  rulebooks: "M6 4h10l2 2v14H6zM9 9h6M9 13h6M9 17h4",
  members: "M9 11a3 3 0 1 0 0-6 3 3 0 0 0 0 6zM3 20c0-3.3 2.7-5 6-5s6 1.7 6 5M17 11a2.5 2.5 0 1 0 0-5M21 19c0-2.3-1.4-3.8-3.5-4.4",
  account: "M12 12a4 4 0 1 0 0-8 4 4 0 0 0 0 8zM4 21c0-4 3.6-6 8-6s8 2 8 6",
  review: "M5 12l4 4L19 6",
};

export function NavIcon({ name, className = "h-5 w-5" }: { name: NavItem["icon"]; className?: string }) {
  return (
    <svg viewBox="0 0 24 24" className={className} fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" strokeLinejoin="round" aria-hidden="true">
      <path d={PATHS[name]} />
    </svg>
  );
}
