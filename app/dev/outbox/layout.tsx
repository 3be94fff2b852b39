import Link from "next/link";
import type { ReactNode } from "react";

export default function DevOutboxLayout({ children }: { children: ReactNode }) {
  return (
    <div className="min-h-screen">
      <header className="bg-ink-900 px-4 py-3 text-white">
        <div className="mx-auto flex max-w-4xl items-center justify-between gap-3">
          <Link href="/dev/outbox" className="font-bold">
            Flueward · development outbox
          </Link>
          <Link href="/jobs" className="text-sm text-ink-200 hover:text-white hover:underline">
            Back to the app
          </Link>
        </div>
      </header>
      <main className="mx-auto max-w-4xl space-y-4 px-4 py-6">{children}</main>
    </div>
  );
}
