import type { ReactNode } from "react";

/** A labelled form control with its hint and its error, announced to screen readers. */
export function Field({
  id,
  label,
  hint,
  error,
  children,
  className = "",
}: {
  id: string;
  label: string;
  hint?: ReactNode;
  error?: string;
  children: ReactNode;
  className?: string;
}) {
  return (
    <div className={className}>
      <label htmlFor={id} className="label">
        {label}
      </label>
      {children}
      {hint && !error ? (
        <p id={`${id}-hint`} className="mt-1 text-xs text-ink-500">
          {hint}
        </p>
      ) : null}
      <p id={`${id}-error`} aria-live="polite" className="mt-1 min-h-0 text-sm font-medium text-fail">
        {error ?? ""}
      </p>
    </div>
  );
}
