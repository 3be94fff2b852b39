"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { apiFetch } from "@/lib/client/api";

/** Make current, archive or restore a rulebook. */
export function RulebookStatusActions({ rulebookId, status, isDefault }: { rulebookId: number; status: "active" | "archived"; isDefault: boolean }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const act = async (body: Record<string, unknown>) => {
    setBusy(true);
    setError(null);
    try {
      await apiFetch(`/api/rulebooks/${rulebookId}`, { method: "PATCH", body });
      router.refresh();
    } catch (e) {
      setError(e instanceof Error ? e.message : "The change failed.");
    } finally {
      setBusy(false);
    }
  };
  return (
    <div className="flex flex-wrap items-center gap-2">
      {status === "active" && !isDefault ? (
        <button type="button" className="btn-secondary" disabled={busy} onClick={() => act({ makeDefault: true })}>
          Make current
        </button>
      ) : null}
      {status === "active" ? (
        <button type="button" className="btn-ghost" disabled={busy || isDefault} title={isDefault ? "The current rulebook cannot be archived" : undefined} onClick={() => act({ status: "archived" })}>
          Archive
        </button>
      ) : (
        <button type="button" className="btn-secondary" disabled={busy} onClick={() => act({ status: "active" })}>
          Restore
        </button>
      )}
      <span aria-live="polite" className="text-sm text-fail">
        {error}
      </span>
    </div>
  );
}
