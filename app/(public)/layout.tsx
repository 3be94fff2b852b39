import Link from "next/link";
import { BrandMark } from "@/components/brand-mark";
import { SafetyNotice } from "@/components/safety-notice";

/** Pages for people outside the company: share links and record verification. No sign-in. */
export default function PublicLayout({ children }: { children: React.ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col">
      <header className="bg-ink-900 px-4 py-3 text-white">
        <div className="mx-auto flex max-w-3xl items-center justify-between">
          <span className="flex items-center gap-2">
            <BrandMark className="h-7 w-7" />
            <span className="font-bold">Flueward</span>
            <span className="text-sm text-ink-300">record check</span>
          </span>
          <Link href="/verify" className="text-sm text-ink-200 hover:text-white">
            Verify a record
          </Link>
        </div>
      </header>
      <main className="mx-auto w-full max-w-3xl flex-1 px-4 py-6">{children}</main>
      <footer className="mx-auto w-full max-w-3xl px-4 pb-6">
        <SafetyNotice />
      </footer>
    </div>
  );
}
