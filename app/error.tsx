"use client";

import { useEffect } from "react";

export default function RootError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  useEffect(() => {
    console.error(error);
  }, [error]);
  return (
    <main className="mx-auto flex min-h-screen max-w-md flex-col justify-center gap-4 px-6">
      <h1 className="text-2xl font-bold">Something went wrong</h1>
      <p className="text-ink-600">
        The page could not be shown. Nothing you saved was lost. Try again; if it keeps happening, tell your office
        {error.digest ? ` (reference ${error.digest})` : ""}.
      </p>
      <button type="button" onClick={reset} className="btn-primary self-start">
        Try again
      </button>
    </main>
  );
}
