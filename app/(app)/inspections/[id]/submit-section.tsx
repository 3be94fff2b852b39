"use client";

import { useState } from "react";
import { useController, type Control } from "react-hook-form";
import { FindingStatusChip } from "@/components/findings/finding-status";
import { SignatureField } from "@/components/signature/signature-field";
import { fieldId } from "@/components/inspection/field-id";
import { EMPTY_SIGNATURE, type SignatureValue } from "@/lib/schemas/signature-values";
import { JUSTIFICATION_MIN_LENGTH, findingKey, submissionBlockers, type InspectionFinding } from "@/lib/inspections/evaluate";
import { Section } from "./form-bits";
import type { InspectionFormValues } from "./form-values";

/**
 * The last step: every fail and needs-info is fixed or justified in writing (for the supervisor to
 * read), then the installer signs and submits.
 */
export function SubmitSection({
  control,
  findings,
  onSubmit,
  busy,
  error,
  defaultName,
}: {
  control: Control<InspectionFormValues>;
  findings: InspectionFinding[];
  onSubmit: (signature: { typedName: string; signaturePng: string }) => void;
  busy: boolean;
  error: string | null;
  defaultName: string;
}) {
  const { field } = useController({ control, name: "justifications" });
  const justifications = (field.value ?? {}) as InspectionFormValues["justifications"];
  const open = findings.filter((f) => f.status === "fail" || f.status === "needs-info");
  const blockers = submissionBlockers(findings, justifications);
  const [signature, setSignature] = useState<SignatureValue>({ ...EMPTY_SIGNATURE, typedName: defaultName });
  const [signatureError, setSignatureError] = useState<string | null>(null);

  const setJustification = (key: string, patch: Partial<{ text: string; reference: string }>) => {
    const current = justifications[key] ?? { text: "", reference: "" };
    field.onChange({ ...justifications, [key]: { ...current, ...patch } });
  };

  return (
    <Section id="submit" title="Sign and submit">
      {open.length === 0 ? (
        <p className="rounded-md bg-pass-soft px-3 py-2 text-sm text-pass">Every check passes or is a warning. Review the warnings, then sign.</p>
      ) : (
        <div className="space-y-3">
          <p className="text-sm text-ink-700">
            Fix each finding below before leaving, or write why it may stay — for example the manufacturer&apos;s instructions allow it — with a reference. Your supervisor sees every justification.
          </p>
          <ul className="space-y-3" id={fieldId("justifications")}>
            {open.map((f) => {
              const key = findingKey(f);
              const j = justifications[key] ?? { text: "", reference: "" };
              const ok = j.text.trim().length >= JUSTIFICATION_MIN_LENGTH;
              const safeId = fieldId(`justifications.${key}`);
              return (
                <li key={key} className={`card space-y-2 border-l-4 p-3 ${ok ? "border-l-ink-300" : f.status === "fail" ? "border-l-fail" : "border-l-info"}`}>
                  <div className="flex items-start justify-between gap-2">
                    <p className="font-semibold">{f.title}</p>
                    <FindingStatusChip status={f.status} />
                  </div>
                  <p className="text-sm text-ink-700">{f.message}</p>
                  <label className="label" htmlFor={`${safeId}-text`}>
                    Justification
                  </label>
                  <textarea
                    id={`${safeId}-text`}
                    rows={2}
                    className="input text-sm"
                    maxLength={2000}
                    value={j.text}
                    placeholder="Why this may stay as it is"
                    onChange={(e) => setJustification(key, { text: e.target.value })}
                  />
                  <label className="label" htmlFor={`${safeId}-ref`}>
                    Reference
                  </label>
                  <input
                    id={`${safeId}-ref`}
                    className="input text-sm"
                    maxLength={300}
                    value={j.reference}
                    placeholder="e.g. Installation manual p. 14, section 5.2"
                    onChange={(e) => setJustification(key, { reference: e.target.value })}
                  />
                  {!ok ? <p className="text-xs text-ink-500">At least {JUSTIFICATION_MIN_LENGTH} characters, or fix the finding.</p> : null}
                </li>
              );
            })}
          </ul>
        </div>
      )}

      <div className="card space-y-3 p-4">
        <SignatureField value={signature} onChange={setSignature} error={signatureError ?? undefined} label="Installer's signature" />
        <div aria-live="assertive">{error ? <p role="alert" className="rounded-md bg-fail-soft px-3 py-2 text-sm font-medium text-fail">{error}</p> : null}</div>
        <button
          type="button"
          className="btn-primary w-full sm:w-auto"
          disabled={busy || blockers.length > 0}
          onClick={() => {
            if (signature.typedName.trim().length < 2) return setSignatureError("Type your full name.");
            if (!signature.signaturePng) return setSignatureError("Draw your signature in the box.");
            setSignatureError(null);
            onSubmit({ typedName: signature.typedName.trim(), signaturePng: signature.signaturePng });
          }}
        >
          {busy ? "Submitting…" : blockers.length > 0 ? `${blockers.length} finding${blockers.length === 1 ? "" : "s"} to fix or justify` : "Sign and submit for review"}
        </button>
      </div>
    </Section>
  );
}
