"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { apiFetch } from "@/lib/client/api";

/** Supervisors may move a draft to another version of its rulebook (usually the newest). */
export function RepinControl({ inspectionId, currentVersionId, versions }: { inspectionId: number; currentVersionId: number; versions: { id: number; versionNumber: number }[] }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  return (
    <span className="inline-flex items-center gap-2">
      <label htmlFor="repin" className="sr-only">
        Re-pin to rulebook version
      </label>
      <select
        id="repin"
        className="input w-auto py-1 text-sm"
        value={currentVersionId}
        disabled={busy}
        onChange={async (e) => {
          setBusy(true);
          setError(null);
          try {
            await apiFetch(`/api/inspections/${inspectionId}/repin`, { method: "POST", body: { rulebookVersionId: Number(e.target.value) } });
            router.refresh();
          } catch (err) {
            setError(err instanceof Error ? err.message : "Could not re-pin.");
          } finally {
            setBusy(false);
          }
        }}
      >
        {versions.map((v) => (
          <option key={v.id} value={v.id}>
            Version {v.versionNumber}
          </option>
        ))}
      </select>
      {error ? <span className="text-xs text-fail">{error}</span> : null}
    </span>
  );
}
