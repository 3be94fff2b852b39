import type { Comparator, Finding, FindingStatus } from "@/lib/venting";
// The number formatter alone, not the engine's index (which brings zod into the browser).
import { fmt as formatNumber } from "@/lib/venting/format";
import { FindingStatusChip } from "./finding-status";

const ORDER: Record<FindingStatus, number> = { fail: 0, "needs-info": 1, warn: 2, pass: 3, "not-applicable": 4 };

const TONE: Record<FindingStatus, string> = {
  fail: "border-l-fail",
  warn: "border-l-warn",
  "needs-info": "border-l-info",
  pass: "border-l-pass",
  "not-applicable": "border-l-na border-dashed",
};

const COMPARATOR_WORDS = { "≥": "at least", "≤": "at most", "=": "exactly", ">": "more than", "<": "less than", between: "between" } as const satisfies Record<Comparator, string>;

function requirementText(finding: Finding): string | null {
  const r = finding.required;
  if (!r) return null;
  const word = COMPARATOR_WORDS[r.comparator];
  if (r.comparator === "between" && r.upperValue !== undefined) return `${word} ${formatNumber(r.value)} and ${formatNumber(r.upperValue)} ${r.unit}`;
  return `${word} ${formatNumber(r.value)} ${r.unit}`;
}

const SAFETY_TEXT = {
  co: "Carbon monoxide: if readings are high, stop, make the appliance safe, ventilate and follow your CO procedure.",
  spillage: "Spillage sends combustion products into the home: stop, make safe and correct the venting before leaving the appliance in service.",
  concealed_single_wall: "Single-wall pipe in a concealed or unconditioned space is a fire and condensation hazard: replace it with the listed material.",
} as const;

/**
 * Findings as a list: problems first, each with measured and required values, units, the
 * rulebook citation and what to do. `onSelect` lets the inspection editor jump to the field.
 */
export function FindingsList({ findings, onSelect, showPasses = true }: { findings: readonly (Finding & { rulebookVersion?: string })[]; onSelect?: (finding: Finding) => void; showPasses?: boolean }) {
  // "Show passes" also shows what does not apply: neither asks anything of the installer.
  const sorted = [...findings].filter((f) => showPasses || (f.status !== "pass" && f.status !== "not-applicable")).sort((a, b) => ORDER[a.status] - ORDER[b.status]);
  if (sorted.length === 0) return <p className="text-sm text-ink-600">No findings to show.</p>;
  return (
    <ul className="space-y-2" aria-label="Findings">
      {sorted.map((finding, index) => {
        const requirement = requirementText(finding);
        const body = (
          <>
            <div className="flex items-start justify-between gap-2">
              <p className="font-semibold text-ink-900">{finding.title}</p>
              <FindingStatusChip status={finding.status} />
            </div>
            <p className="mt-1 text-sm text-ink-700">{finding.message}</p>
            {finding.measured || requirement || finding.smallest ? (
              <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-sm">
                {finding.measured ? (
                  <>
                    <dt className="text-ink-500">Measured</dt>
                    <dd className="font-medium">
                      {formatNumber(finding.measured.value)} {finding.measured.unit}
                    </dd>
                  </>
                ) : null}
                {requirement ? (
                  <>
                    <dt className="text-ink-500">Required</dt>
                    <dd className="font-medium">{requirement}</dd>
                  </>
                ) : null}
                {finding.smallest ? (
                  <>
                    <dt className="text-ink-500">Smallest that works</dt>
                    <dd className="font-semibold text-ink-900" data-smallest>
                      {formatNumber(finding.smallest.value)} {finding.smallest.unit} <span className="font-normal text-ink-500">(company tables)</span>
                    </dd>
                  </>
                ) : null}
              </dl>
            ) : null}
            <p className="mt-2 text-xs text-ink-500">
              <span className="font-mono">{finding.code}</span>
              {" · "}
              {finding.citation ? <>Source: {finding.citation}</> : finding.status === "not-applicable" ? <>No rule applies to what was entered.</> : <>The rulebook has no value for this check.</>}
              {finding.rulebookVersion ? <> · {finding.rulebookVersion}</> : null}
            </p>
            {finding.safety && finding.status !== "pass" && finding.status !== "not-applicable" ? (
              <p role="note" className="mt-2 rounded border-l-4 border-fail bg-fail-soft px-2 py-1 text-xs font-medium text-fail">
                {SAFETY_TEXT[finding.safety]} Local code and the manufacturer&apos;s instructions govern; a licensed professional must verify the work.
              </p>
            ) : null}
          </>
        );
        const tone = TONE[finding.status];
        return (
          <li key={`${finding.code}-${finding.target.path}-${index}`} data-status={finding.status} data-code={finding.code}>
            {onSelect ? (
              <button type="button" onClick={() => onSelect(finding)} className={`card block w-full border-l-4 p-3 text-left hover:bg-ink-50 ${tone}`}>
                {body}
              </button>
            ) : (
              <div className={`card border-l-4 p-3 ${tone}`}>{body}</div>
            )}
          </li>
        );
      })}
    </ul>
  );
}
