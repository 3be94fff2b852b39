"use client";

import { useState } from "react";
import { FindingsList } from "@/components/findings/findings-list";
import { focusPath } from "@/components/inspection/field-id";
import type { Finding, FindingSummary } from "@/lib/venting";
import type { InspectionFinding } from "@/lib/inspections/evaluate";

function Counts({ summary }: { summary: FindingSummary }) {
  const parts = [
    { n: summary.counts.fail, label: "fail", cls: "text-fail" },
    { n: summary.counts["needs-info"], label: "needs info", cls: "text-info" },
    { n: summary.counts.warn, label: "warning", cls: "text-warn" },
    { n: summary.counts.pass, label: "pass", cls: "text-pass" },
    // Shown only when there are any, to keep the phone's findings bar on one line; stored
    // summaries from before the status existed have no count for it.
    ...(summary.counts["not-applicable"] ? [{ n: summary.counts["not-applicable"], label: "not applicable", cls: "text-na" }] : []),
  ];
  return (
    <p className="flex flex-wrap gap-x-3 text-sm font-semibold" data-testid="findings-counts">
      {parts.map((p) => (
        <span key={p.label} className={p.cls}>
          {p.n} {p.label}
        </span>
      ))}
    </p>
  );
}

/**
 * The live findings: a column beside the form on wide screens, a bar with a sheet on phones.
 * Tapping a finding scrolls to and focuses the field it concerns.
 */
export function FindingsPanel({ findings, summary, rulebookLabel }: { findings: InspectionFinding[]; summary: FindingSummary; rulebookLabel: string }) {
  const [open, setOpen] = useState(false);
  const [showPasses, setShowPasses] = useState(false);
  const select = (finding: Finding) => {
    setOpen(false);
    window.setTimeout(() => focusPath(finding.target.path), open ? 150 : 0);
  };
  const list = (
    <>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <Counts summary={summary} />
        <label className="flex items-center gap-1 text-xs text-ink-600">
          <input type="checkbox" className="accent-copper-600" checked={showPasses} onChange={(e) => setShowPasses(e.target.checked)} />
          Show passes and not applicable
        </label>
      </div>
      <p className="text-xs text-ink-500">Checked against {rulebookLabel}. Findings report the rulebook; local code and the manufacturer&apos;s instructions govern.</p>
      <FindingsList findings={findings as unknown as Finding[]} onSelect={select} showPasses={showPasses} />
    </>
  );
  return (
    <>
      <aside aria-label="Findings" className="sticky top-4 hidden max-h-[calc(100vh-2rem)] space-y-3 overflow-y-auto pb-6 lg:block">
        <h2 className="text-lg font-bold">Findings</h2>
        {list}
      </aside>
      <div className="fixed inset-x-0 bottom-[calc(56px+env(safe-area-inset-bottom))] z-30 border-t border-ink-200 bg-white/95 px-4 py-2 shadow-[0_-4px_12px_rgba(0,0,0,0.06)] backdrop-blur lg:hidden">
        <button type="button" className="flex w-full items-center justify-between gap-2 text-left" onClick={() => setOpen(true)} aria-expanded={open} aria-controls="findings-sheet">
          <Counts summary={summary} />
          <span className="whitespace-nowrap text-sm font-semibold text-copper-700">Findings ▲</span>
        </button>
      </div>
      {open ? (
        <div id="findings-sheet" role="dialog" aria-modal="true" aria-label="Findings" className="fixed inset-0 z-40 flex flex-col bg-ink-900/40 lg:hidden" onClick={() => setOpen(false)}>
          <div className="mt-auto max-h-[85vh] space-y-3 overflow-y-auto rounded-t-2xl bg-ink-50 p-4" onClick={(e) => e.stopPropagation()}>
            <div className="flex items-center justify-between">
              <h2 className="text-lg font-bold">Findings</h2>
              <button type="button" className="btn-ghost" onClick={() => setOpen(false)}>
                Close
              </button>
            </div>
            {list}
          </div>
        </div>
      ) : null}
    </>
  );
}
