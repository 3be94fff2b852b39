import Link from "next/link";

export default function SignedInNotFound() {
  return (
    <div className="card p-6">
      <h1 className="text-xl font-bold">Not found</h1>
      <p className="mt-2 text-ink-600">There is nothing here for your company. It may have been removed, or the link is wrong.</p>
      <Link href="/jobs" className="btn-primary mt-4">
        Back to jobs
      </Link>
    </div>
  );
}
