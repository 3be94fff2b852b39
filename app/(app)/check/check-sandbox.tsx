"use client";

import { useState } from "react";
import { FindingsList } from "@/components/findings/findings-list";
import { ErrorState } from "@/components/ui/states";
import { apiFetch, ApiError } from "@/lib/client/api";
import type { Finding, FindingStatus } from "@/lib/venting";

interface CheckResponse {
  rulebook: { name: string; versionNumber: number; versionId: number };
  summary: { counts: Record<FindingStatus, number>; worst: FindingStatus | null } & Record<string, unknown>;
  findings: (Finding & { rulebookVersion: string })[];
}

export function CheckSandbox({ versions, example }: { versions: { versionId: number; label: string; current: boolean }[]; example: string }) {
  const [text, setText] = useState(example);
  const [versionId, setVersionId] = useState<number | undefined>(versions.find((v) => v.current)?.versionId ?? versions[0]?.versionId);
  const [parseError, setParseError] = useState<string | null>(null);
  const [check, setCheck] = useState<{ pending: boolean; data?: CheckResponse; error?: Error }>({ pending: false });

  const run = () => {
    setParseError(null);
    let input: unknown;
    try {
      input = JSON.parse(text);
    } catch (e) {
      setParseError(`The JSON could not be read: ${(e as Error).message}`);
      return;
    }
    setCheck((c) => ({ ...c, pending: true }));
    apiFetch<CheckResponse>("/api/check", { method: "POST", body: { ...(input as object), rulebookVersionId: versionId } }).then(
      (data) => setCheck({ pending: false, data }),
      (error: Error) => setCheck({ pending: false, error }),
    );
  };

  const result = check.data;
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
          <button type="button" className="btn-primary" onClick={run} disabled={check.pending}>
            {check.pending ? "Checking…" : "Run check"}
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
          {check.error ? (
            <ErrorState
              title={check.error.message}
              message={check.error instanceof ApiError ? Object.entries(check.error.fields).slice(0, 8).map(([k, m]) => `${k}: ${m}`).join(" · ") : undefined}
            />
          ) : null}
        </div>
        {result ? (
          <>
            <p className="text-sm text-ink-700" data-testid="check-summary">
              Checked against {result.rulebook.name}, version {result.rulebook.versionNumber}:{" "}
              {(["fail", "needs-info", "warn", "pass", "not-applicable"] as const).map((s) => `${result.summary.counts[s] ?? 0} ${s.replace("-", " ")}`).join(", ")}
            </p>
            <FindingsList findings={result.findings} />
          </>
        ) : !check.error && !parseError ? (
          <p className="text-sm text-ink-500">Run the check to see findings.</p>
        ) : null}
      </section>
    </div>
  );
}
