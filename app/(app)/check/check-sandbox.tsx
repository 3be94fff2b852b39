"use client";

import { useState } from "react";
import { useMutation } from "@tanstack/react-query";
import { withQueryClient } from "@/components/query-client";
import { FindingsList } from "@/components/findings/findings-list";
import { ErrorState } from "@/components/ui/states";
import { apiFetch, ApiError } from "@/lib/client/api";
import type { Finding, FindingStatus } from "@/lib/venting";

interface CheckResponse {
  rulebook: { name: string; versionNumber: number; versionId: number };
  summary: { counts: Record<FindingStatus, number>; worst: FindingStatus | null } & Record<string, unknown>;
  findings: (Finding & { rulebookVersion: string })[];
}

function CheckSandboxView({ versions, example }: { versions: { versionId: number; label: string; current: boolean }[]; example: string }) {
  const [text, setText] = useState(example);
  const [versionId, setVersionId] = useState<number | undefined>(versions.find((v) => v.current)?.versionId ?? versions[0]?.versionId);
  const [parseError, setParseError] = useState<string | null>(null);
  const check = useMutation({
    mutationFn: (body: unknown) => apiFetch<CheckResponse>("/api/check", { method: "POST", body }),
  });

  const run = () => {
    setParseError(null);
    let input: unknown;
    try {
      input = JSON.parse(text);
    } catch (e) {
      setParseError(`The JSON could not be read: ${(e as Error).message}`);
      return;
    }
    check.mutate({ ...(input as object), rulebookVersionId: versionId });
  };

  return (
    <div className="grid gap-6 xl:grid-cols-2">
      <div className="space-y-3">
        <div>
          <label htmlFor="check-version" className="label">
            Rulebook version
          </label>
          <select id="check-version" className="input" value={versionId} onChange={(e) => setVersionId(Number(e.target.value))}>
            {versions.map((v) => (
              <option key={v.versionId} value={v.versionId}>
                {v.label}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="check-input" className="label">
            Check input (JSON)
          </label>
          <textarea id="check-input" className="input h-[28rem] font-mono text-xs" spellCheck={false} value={text} onChange={(e) => setText(e.target.value)} />
        </div>
        <div className="flex gap-2">
          <button type="button" className="btn-primary" onClick={run} disabled={check.isPending}>
            {check.isPending ? "Checking…" : "Run check"}
          </button>
          <button type="button" className="btn-ghost" onClick={() => setText(example)}>
            Reset example
          </button>
        </div>
      </div>
      <section aria-labelledby="check-results" className="space-y-3">
        <h2 id="check-results" className="text-lg font-bold">
          Findings
        </h2>
        <div aria-live="polite">
          {parseError ? <ErrorState title="Not valid JSON" message={parseError} /> : null}
          {check.isError ? (
            <ErrorState
              title={check.error.message}
              message={check.error instanceof ApiError ? Object.entries(check.error.fields).slice(0, 8).map(([k, m]) => `${k}: ${m}`).join(" · ") : undefined}
            />
          ) : null}
        </div>
        {check.data ? (
          <>
            <p className="text-sm text-ink-700" data-testid="check-summary">
              Checked against {check.data.rulebook.name}, version {check.data.rulebook.versionNumber}:{" "}
              {(["fail", "needs-info", "warn", "pass"] as const).map((s) => `${check.data.summary.counts[s] ?? 0} ${s}`).join(", ")}
            </p>
            <FindingsList findings={check.data.findings} />
          </>
        ) : !check.isError && !parseError ? (
          <p className="text-sm text-ink-500">Run the check to see findings.</p>
        ) : null}
      </section>
    </div>
  );
}

export const CheckSandbox = withQueryClient(CheckSandboxView);
