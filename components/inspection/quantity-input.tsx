"use client";

import { useEffect, useState } from "react";
import { useController, type Control, type FieldPath, type FieldValues } from "react-hook-form";
import { kwToBtuh, parseLength } from "@/lib/venting";
import { fieldId } from "./field-id";

export type QuantityKind = "ft" | "in" | "btuh" | "number" | "count";

const UNIT_LABEL: Record<QuantityKind, string> = { ft: "ft", in: "in", btuh: "Btu/h", number: "", count: "" };
const HINTS: Record<QuantityKind, string> = {
  ft: "Feet and inches; 1.93 m or 6' 4\" typed in the feet box also work",
  in: "Inches; 1/4\" steps as 0.25, or mm",
  btuh: "Btu/h; 23.4 kW also works",
  number: "",
  count: "",
};

function format(value: unknown, kind: QuantityKind): string {
  if (typeof value !== "number" || !Number.isFinite(value)) return "";
  const rounded = kind === "btuh" ? Math.round(value) : Math.round(value * 1000) / 1000;
  return String(rounded);
}

/** Parses what was typed into the stored number; null when empty; an error message when unreadable. */
export function parseQuantity(text: string, kind: QuantityKind, allowNegative: boolean): { value: number | null } | { error: string } {
  const trimmed = text.trim();
  if (trimmed === "") return { value: null };
  const negative = allowNegative && trimmed.startsWith("-");
  const body = negative ? trimmed.slice(1) : trimmed;
  if (kind === "ft" || kind === "in") {
    const parsed = parseLength(body, kind);
    if (!parsed.ok) return { error: parsed.error };
    const value = kind === "ft" ? parsed.valueFt : parsed.valueFt * 12;
    return { value: negative ? -value : value };
  }
  if (kind === "btuh") {
    const kw = /^(\d+(?:[.,]\d+)?)\s*kw$/i.exec(body);
    if (kw) return { value: Math.round(kwToBtuh(Number(kw[1]!.replace(",", ".")))) };
    const n = Number(body.replace(/[,\s]/g, "").replace(/btu\/?h$/i, ""));
    return Number.isFinite(n) && n >= 0 ? { value: n } : { error: "Enter the input in Btu/h (e.g. 80000) or kW (e.g. 23.4 kW)." };
  }
  const n = Number(body.replace(",", "."));
  if (kind === "count") return Number.isInteger(n) && n >= 0 && !negative ? { value: n } : { error: "Enter a whole number (0, 1, 2…)." };
  if (!Number.isFinite(n)) return { error: "Enter a number." };
  return { value: negative ? -n : n };
}

/**
 * A numeric field with its unit, a decimal keyboard on phones, feet-and-inches and metric entry
 * for lengths, and a plain message when the entry cannot be read (the last good value is kept).
 */
export function QuantityInput<T extends FieldValues>({
  control,
  name,
  label,
  kind = "number",
  unit,
  allowNegative = false,
  hint,
  disabled,
  className = "",
}: {
  control: Control<T>;
  name: FieldPath<T>;
  label: string;
  kind?: QuantityKind;
  unit?: string;
  allowNegative?: boolean;
  hint?: string;
  disabled?: boolean;
  className?: string;
}) {
  if (kind === "ft") return <FeetInchesInput control={control} name={name} label={label} hint={hint} disabled={disabled} className={className} />;
  return <PlainQuantityInput control={control} name={name} label={label} kind={kind} unit={unit} allowNegative={allowNegative} hint={hint} disabled={disabled} className={className} />;
}

function PlainQuantityInput<T extends FieldValues>({
  control,
  name,
  label,
  kind,
  unit,
  allowNegative,
  hint,
  disabled,
  className,
}: {
  control: Control<T>;
  name: FieldPath<T>;
  label: string;
  kind: QuantityKind;
  unit?: string;
  allowNegative: boolean;
  hint?: string;
  disabled?: boolean;
  className: string;
}) {
  const { field, fieldState } = useController({ control, name });
  const [text, setText] = useState(() => format(field.value, kind));
  const [error, setError] = useState<string | null>(null);
  const id = fieldId(name);

  useEffect(() => {
    const parsed = parseQuantity(text, kind, allowNegative);
    const current = "value" in parsed ? parsed.value : undefined;
    if (current !== field.value) setText(format(field.value, kind));
    // Only follow outside changes (reset, duplicate, reload), not our own typing.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [field.value]);

  const commit = (next: string, final: boolean) => {
    const parsed = parseQuantity(next, kind, allowNegative);
    if ("error" in parsed) {
      if (final) setError(parsed.error);
      return;
    }
    setError(null);
    if (parsed.value !== field.value) field.onChange(parsed.value);
    if (final) setText(format(parsed.value, kind));
  };

  const unitLabel = unit ?? UNIT_LABEL[kind];
  // An unreadable entry first; then the schema's range message for the value that was kept.
  const shown = error ?? fieldState.error?.message ?? null;
  return (
    <div className={className}>
      <label htmlFor={id} className="label">
        {label}
        {unitLabel ? <span className="font-normal text-ink-500"> ({unitLabel})</span> : null}
      </label>
      <input
        id={id}
        type="text"
        inputMode="decimal"
        enterKeyHint="next"
        autoComplete="off"
        className="input"
        disabled={disabled}
        value={text}
        aria-invalid={shown ? true : undefined}
        aria-describedby={`${id}-msg`}
        onChange={(e) => {
          setText(e.target.value);
          commit(e.target.value, false);
        }}
        onBlur={() => {
          commit(text, true);
          field.onBlur();
        }}
      />
      <p id={`${id}-msg`} aria-live="polite" className={`mt-1 text-xs ${shown ? "font-medium text-fail" : "text-ink-500"}`}>
        {shown ?? hint ?? HINTS[kind]}
      </p>
    </div>
  );
}

function splitFeet(value: unknown): { ft: string; inch: string } {
  if (typeof value !== "number" || !Number.isFinite(value)) return { ft: "", inch: "" };
  let ft = Math.floor(value);
  let inch = Math.round((value - ft) * 12 * 100) / 100;
  if (inch >= 12) {
    ft += 1;
    inch = 0;
  }
  return { ft: String(ft), inch: inch === 0 ? "" : String(inch) };
}

/** Feet and inches as two boxes with decimal keyboards; either box also reads typed units (m, mm, 6' 4"). */
function FeetInchesInput<T extends FieldValues>({
  control,
  name,
  label,
  hint,
  disabled,
  className,
}: {
  control: Control<T>;
  name: FieldPath<T>;
  label: string;
  hint?: string;
  disabled?: boolean;
  className: string;
}) {
  const { field, fieldState } = useController({ control, name });
  const [parts, setParts] = useState(() => splitFeet(field.value));
  const [error, setError] = useState<string | null>(null);
  const id = fieldId(name);

  const total = (p: { ft: string; inch: string }): { value: number | null } | { error: string } => {
    if (p.ft.trim() === "" && p.inch.trim() === "") return { value: null };
    const ft = p.ft.trim() === "" ? { ok: true as const, valueFt: 0 } : parseLength(p.ft, "ft");
    const inch = p.inch.trim() === "" ? { ok: true as const, valueFt: 0 } : parseLength(p.inch, "in");
    if (!ft.ok) return { error: ft.error };
    if (!inch.ok) return { error: inch.error };
    return { value: Math.round((ft.valueFt + inch.valueFt) * 10000) / 10000 };
  };

  useEffect(() => {
    const current = total(parts);
    if (!("value" in current) || current.value !== field.value) setParts(splitFeet(field.value));
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [field.value]);

  const update = (next: { ft: string; inch: string }, final: boolean) => {
    setParts(next);
    const parsed = total(next);
    if ("error" in parsed) {
      if (final) setError(parsed.error);
      return;
    }
    setError(null);
    if (parsed.value !== field.value) field.onChange(parsed.value);
    if (final) setParts(splitFeet(parsed.value));
  };

  const shown = error ?? fieldState.error?.message ?? null;
  return (
    <fieldset className={className}>
      <legend className="label">{label}</legend>
      <div className="flex items-center gap-2">
        <input
          id={id}
          aria-label={`${label}, feet`}
          type="text"
          inputMode="decimal"
          enterKeyHint="next"
          autoComplete="off"
          className="input w-full"
          disabled={disabled}
          value={parts.ft}
          aria-invalid={shown ? true : undefined}
          aria-describedby={`${id}-msg`}
          onChange={(e) => update({ ...parts, ft: e.target.value }, false)}
          onBlur={() => {
            update(parts, true);
            field.onBlur();
          }}
        />
        <span className="text-sm text-ink-500">ft</span>
        <input
          id={`${id}-in`}
          aria-label={`${label}, inches`}
          type="text"
          inputMode="decimal"
          enterKeyHint="next"
          autoComplete="off"
          className="input w-full"
          disabled={disabled}
          value={parts.inch}
          aria-invalid={shown ? true : undefined}
          onChange={(e) => update({ ...parts, inch: e.target.value }, false)}
          onBlur={() => {
            update(parts, true);
            field.onBlur();
          }}
        />
        <span className="text-sm text-ink-500">in</span>
      </div>
      <p id={`${id}-msg`} aria-live="polite" className={`mt-1 text-xs ${shown ? "font-medium text-fail" : "text-ink-500"}`}>
        {shown ?? hint ?? HINTS.ft}
      </p>
    </fieldset>
  );
}
