import Link from "next/link";

export const metadata = { title: "Not allowed" };

export default function ForbiddenPage() {
  return (
    <main className="mx-auto flex min-h-screen max-w-md flex-col justify-center gap-4 px-6">
      <p className="text-sm font-semibold uppercase tracking-wide text-copper-600">403</p>
      <h1 className="text-2xl font-bold">Your role does not allow this page</h1>
      <p className="text-ink-600">Ask an admin of your company if you need access.</p>
      <Link href="/jobs" className="btn-primary self-start">
        Back to jobs
      </Link>
    </main>
  );
}
