import Link from "next/link";

export default function NotFound() {
  return (
    <main className="mx-auto flex min-h-screen max-w-md flex-col justify-center gap-4 px-6">
      <p className="text-sm font-semibold uppercase tracking-wide text-copper-600">404</p>
      <h1 className="text-2xl font-bold">Not found</h1>
      <p className="text-ink-600">This page does not exist, or it belongs to another company.</p>
      <Link href="/jobs" className="btn-primary self-start">
        Back to jobs
      </Link>
    </main>
  );
}
