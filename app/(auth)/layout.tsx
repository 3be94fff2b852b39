import { BrandMark } from "@/components/brand-mark";
import { SafetyNotice } from "@/components/safety-notice";

export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col bg-ink-900">
      <main className="flex flex-1 flex-col items-center justify-center px-4 py-10">
        <div className="mb-6 flex items-center gap-3 text-white">
          <BrandMark className="h-10 w-10" />
          <div>
            <p className="text-xl font-bold tracking-tight">Flueward</p>
            <p className="text-sm text-ink-300">Venting checks and signed records</p>
          </div>
        </div>
        <div className="w-full max-w-sm">{children}</div>
      </main>
      <footer className="mx-auto max-w-2xl px-6 pb-6 text-center [&_p]:text-ink-400">
        <SafetyNotice />
      </footer>
    </div>
  );
}
