import Link from "next/link";
import type { ReactNode } from "react";
import { BrandMark } from "@/components/brand-mark";
import { SafetyNotice } from "@/components/safety-notice";
import { ROLE_LABELS, type Role } from "@/lib/auth/roles";
import { navItemsFor } from "./nav-items";
import { BottomLinks, SidebarLinks } from "./nav-links";
import { SignOutButton } from "./sign-out-button";

export function AppShell({ member, children }: { member: { name: string; role: Role; companyName: string }; children: ReactNode }) {
  const items = navItemsFor(member.role);
  return (
    <div className="min-h-screen lg:flex">
      <aside className="hidden w-60 shrink-0 flex-col bg-ink-900 px-3 py-5 lg:flex" aria-label="Main">
        <Link href="/jobs" className="mb-6 flex items-center gap-2 px-2 text-white">
          <BrandMark />
          <span className="text-lg font-bold tracking-tight">Flueward</span>
        </Link>
        <nav aria-label="Main navigation">
          <SidebarLinks items={items} />
        </nav>
        <div className="mt-auto space-y-2 border-t border-ink-700 px-2 pt-4 text-sm">
          <p className="font-semibold text-white" data-testid="member-name">{member.name}</p>
          <p className="text-ink-300">
            {ROLE_LABELS[member.role]} · {member.companyName}
          </p>
          <SignOutButton className="btn-ghost -ml-4 text-ink-200 hover:bg-ink-800 hover:text-white" />
        </div>
      </aside>

      <div className="flex min-w-0 flex-1 flex-col">
        <header className="sticky top-0 z-20 flex items-center justify-between gap-3 bg-ink-900 px-4 py-2 text-white lg:hidden">
          <Link href="/jobs" className="flex items-center gap-2">
            <BrandMark className="h-7 w-7" />
            <span className="font-bold">Flueward</span>
          </Link>
          <div className="min-w-0 text-right text-xs leading-tight">
            <p className="truncate font-semibold">{member.name}</p>
            <p className="truncate text-ink-300">
              {ROLE_LABELS[member.role]} · {member.companyName}
            </p>
          </div>
        </header>

        <main id="main" className="mx-auto w-full max-w-6xl flex-1 px-4 pb-28 pt-5 sm:px-6 lg:pb-10">
          {children}
        </main>

        <footer className="mx-auto w-full max-w-6xl px-4 pb-24 sm:px-6 lg:pb-6">
          <SafetyNotice />
        </footer>

        <nav aria-label="Main navigation" className="fixed inset-x-0 bottom-0 z-20 border-t border-ink-200 bg-white pb-[env(safe-area-inset-bottom)] lg:hidden">
          <BottomLinks items={items.filter((item) => item.phone)} />
        </nav>
      </div>
    </div>
  );
}
