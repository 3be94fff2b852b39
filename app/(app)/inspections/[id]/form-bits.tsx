"use client";

import type { ReactNode } from "react";
import { useController, type Control, type FieldPath, type FieldValues } from "react-hook-form";
import { fieldId } from "@/components/inspection/field-id";

/** A select bound to the form, with an id a finding can jump to. */
export function SelectField<T extends FieldValues>({
  control,
  name,
  label,
  options,
  allowEmpty,
  disabled,
  className = "",
}: {
  control: Control<T>;
  name: FieldPath<T>;
  label: string;
  options: Record<string, string> | { value: string; label: string }[];
  allowEmpty?: string;
  disabled?: boolean;
  className?: string;
}) {
  const { field } = useController({ control, name });
  const list = Array.isArray(options) ? options : Object.entries(options).map(([value, l]) => ({ value, label: l }));
  const id = fieldId(name);
  return (
    <div className={className}>
      <label htmlFor={id} className="label">
        {label}
      </label>
      <select
        id={id}
        className="input"
        disabled={disabled}
        value={(field.value as string | null | undefined) ?? ""}
        onChange={(e) => field.onChange(e.target.value === "" ? null : e.target.value)}
        onBlur={field.onBlur}
      >
        {allowEmpty !== undefined ? <option value="">{allowEmpty}</option> : null}
        {list.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </div>
  );
}

/** Yes / no / not recorded, as three large buttons for gloved thumbs. */
export function TriState<T extends FieldValues>({ control, name, label, disabled, yes = "Yes", no = "No" }: { control: Control<T>; name: FieldPath<T>; label: string; disabled?: boolean; yes?: string; no?: string }) {
  const { field } = useController({ control, name });
  const id = fieldId(name);
  const value = field.value as boolean | null | undefined;
  const button = (v: boolean | null, text: string) => (
    <button
      type="button"
      disabled={disabled}
      aria-pressed={value === v || (v === null && (value === undefined || value === null))}
      onClick={() => field.onChange(v)}
      className={`min-h-[44px] flex-1 rounded-md border px-3 text-sm font-semibold ${
        value === v || (v === null && (value === undefined || value === null)) ? "border-copper-600 bg-copper-50 text-copper-800" : "border-ink-300 bg-white text-ink-700"
      }`}
    >
      {text}
    </button>
  );
  return (
    <div role="group" aria-labelledby={`${id}-label`} id={id}>
      <p id={`${id}-label`} className="label">
        {label}
      </p>
      <div className="flex gap-2">
        {button(true, yes)}
        {button(false, no)}
        {button(null, "Not recorded")}
      </div>
    </div>
  );
}

export function Section({ id, title, children, aside }: { id: string; title: string; children: ReactNode; aside?: ReactNode }) {
  return (
    <section id={id} aria-labelledby={`${id}-title`} className="scroll-mt-28 space-y-4">
      <div className="flex flex-wrap items-baseline justify-between gap-2 border-b border-ink-200 pb-2">
        <h2 id={`${id}-title`} className="text-lg font-bold tracking-tight">
          {title}
        </h2>
        {aside}
      </div>
      {children}
    </section>
  );
}

/** A computed value shown beside the inputs: value, unit and where it comes from. */
export function Readout({ label, value, note, tone = "neutral" }: { label: string; value: string; note?: string; tone?: "neutral" | "fail" | "pass" | "warn" }) {
  const toneClass = tone === "fail" ? "border-fail/40 bg-fail-soft" : tone === "pass" ? "border-pass/30 bg-pass-soft" : tone === "warn" ? "border-warn/30 bg-warn-soft" : "border-ink-200 bg-ink-50";
  return (
    <div className={`rounded-md border px-3 py-2 ${toneClass}`}>
      <p className="text-xs font-semibold uppercase tracking-wide text-ink-500">{label}</p>
      <p className="text-base font-bold text-ink-900">{value}</p>
      {note ? <p className="text-xs text-ink-600">{note}</p> : null}
    </div>
  );
}
