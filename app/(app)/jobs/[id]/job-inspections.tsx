"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { InspectionStatusBadge } from "@/components/inspection/inspection-status-badge";
import { apiFetch } from "@/lib/client/api";
import type { InspectionStatus } from "@/lib/data/inspection-access";

interface Row {
  id: number;
  status: InspectionStatus;
  revision: number;
  installerName: string | null;
  updatedAt: string;
  summary: { counts: Record<string, number> } | null;
}

export function JobInspections({ jobId, inspections, canStart }: { jobId: number; inspections: Row[]; canStart: boolean }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const start = async () => {
    setBusy(true);
    setError(null);
    try {
      const result = await apiFetch<{ id: number }>(`/api/jobs/${jobId}/inspections`, { method: "POST", body: {} });
      router.push(`/inspections/${result.id}`);
    } catch (e) {
      setError(e instanceof Error ? e.message : "The inspection could not be started.");
      setBusy(false);
    }
  };
  return (
    <section aria-labelledby="inspections-title" className="space-y-3">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="inspections-title" className="text-lg font-bold">
          Inspections
        </h2>
        {canStart ? (
          <button type="button" className="btn-primary" onClick={start} disabled={busy}>
            {busy ? "Starting…" : "Start inspection"}
          </button>
        ) : null}
      </div>
      {error ? <p role="alert" className="text-sm text-fail">{error}</p> : null}
      {inspections.length === 0 ? (
        <p className="card p-4 text-sm text-ink-600">
          {canStart ? "No inspection yet. Start one on site to check the venting and combustion air before leaving." : "No inspection was made for this job."}
        </p>
      ) : (
        <ul className="space-y-2">
          {inspections.map((i) => (
            <li key={i.id}>
              <Link href={`/inspections/${i.id}`} className="card flex flex-wrap items-center justify-between gap-2 p-3 hover:bg-ink-50">
                <span className="font-semibold">
                  Inspection #{i.id} · revision {i.revision}
                </span>
                <InspectionStatusBadge status={i.status} />
                <span className="w-full text-xs text-ink-500">
                  {i.installerName ?? "—"} · updated {i.updatedAt.slice(0, 16).replace("T", " ")} UTC
                  {i.summary ? ` · ${i.summary.counts.fail ?? 0} fail, ${i.summary.counts["needs-info"] ?? 0} needs info, ${i.summary.counts.pass ?? 0} pass${i.summary.counts["not-applicable"] ? `, ${i.summary.counts["not-applicable"]} not applicable` : ""}` : ""}
                </span>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
