"use client";

import { useController, useWatch, type Control } from "react-hook-form";
import { fieldId } from "@/components/inspection/field-id";
import { applicableItems, type SiteCheckItemDefinition } from "@/lib/site-checks";
import { Section } from "./form-bits";
import type { InspectionFormValues } from "./form-values";

const ANSWERS = [
  { value: "yes", label: "Yes" },
  { value: "no", label: "No" },
  { value: "na", label: "N/A" },
] as const;

function SiteCheckRow({ control, item, editable }: { control: Control<InspectionFormValues>; item: SiteCheckItemDefinition; editable: boolean }) {
  const { field } = useController({ control, name: `siteChecks.${item.key}` as const });
  const value = (field.value as { answer: "yes" | "no" | "na" | null; note: string } | undefined) ?? { answer: null, note: "" };
  const id = fieldId(`siteChecks.${item.key}`);
  return (
    <li className="card space-y-2 p-3" id={id} data-testid={`site-check-${item.key}`}>
      <p className="font-medium text-ink-900">{item.label}</p>
      {item.help ? <p className="text-xs text-ink-500">{item.help}</p> : null}
      <div role="radiogroup" aria-label={item.label} className="flex gap-2">
        {ANSWERS.map((a) => (
          <button
            key={a.value}
            type="button"
            role="radio"
            aria-checked={value.answer === a.value}
            disabled={!editable}
            onClick={() => field.onChange({ ...value, answer: value.answer === a.value ? null : a.value })}
            className={`min-h-[44px] flex-1 rounded-md border text-sm font-semibold ${
              value.answer === a.value
                ? a.value === "no"
                  ? "border-fail bg-fail-soft text-fail"
                  : a.value === "yes"
                    ? "border-pass bg-pass-soft text-pass"
                    : "border-ink-500 bg-ink-100 text-ink-800"
                : "border-ink-300 bg-white text-ink-700"
            }`}
          >
            {a.label}
          </button>
        ))}
      </div>
      <label className="sr-only" htmlFor={`${id}-note`}>
        Note for {item.label}
      </label>
      <input
        id={`${id}-note`}
        className="input text-sm"
        placeholder="Note (optional)"
        disabled={!editable}
        maxLength={2000}
        value={value.note}
        onChange={(e) => field.onChange({ ...value, note: e.target.value })}
      />
    </li>
  );
}

export function SiteChecksSection({ control, editable, items }: { control: Control<InspectionFormValues>; editable: boolean; items: SiteCheckItemDefinition[] }) {
  const appliances = useWatch({ control, name: "appliances" });
  const applicable = applicableItems(items, appliances);
  return (
    <Section id="siteChecks" title="Site checks" aside={<span className="text-xs text-ink-500">{applicable.length} items for these appliances</span>}>
      <ul className="grid gap-3 md:grid-cols-2">
        {applicable.map((item) => (
          <SiteCheckRow key={item.key} control={control} item={item} editable={editable} />
        ))}
      </ul>
    </Section>
  );
}
