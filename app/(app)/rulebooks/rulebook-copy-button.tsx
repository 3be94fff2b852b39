"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { apiFetch } from "@/lib/client/api";

/** Copies a rulebook's latest version into a new rulebook, then opens the copy. */
export function RulebookCopyButton({ rulebookId, name }: { rulebookId: number; name: string }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  return (
    <span className="inline-flex flex-col">
      <button
        type="button"
        className="btn-ghost"
        disabled={busy}
        onClick={async () => {
          setBusy(true);
          setError(null);
          try {
            const result = await apiFetch<{ rulebook: { id: number } }>("/api/rulebooks", { method: "POST", body: { name: `Copy of ${name}`.slice(0, 200), copyFromRulebookId: rulebookId } });
            router.push(`/rulebooks/${result.rulebook.id}`);
          } catch (e) {
            setError(e instanceof Error ? e.message : "The copy failed.");
          } finally {
            setBusy(false);
          }
        }}
      >
        {busy ? "Copying…" : "Copy"}
      </button>
      {error ? <span className="text-xs text-fail">{error}</span> : null}
    </span>
  );
}
