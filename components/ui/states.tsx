import type { ReactNode } from "react";

export function EmptyState({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div className="card flex flex-col items-center gap-2 px-6 py-10 text-center">
      <p className="text-base font-semibold text-ink-800">{title}</p>
      {children ? <div className="text-sm text-ink-600">{children}</div> : null}
    </div>
  );
}

export function ErrorState({ title = "This could not be loaded.", message, onRetry }: { title?: string; message?: string; onRetry?: () => void }) {
  return (
    <div role="alert" className="rounded-lg border border-fail/30 bg-fail-soft px-4 py-4 text-sm text-fail">
      <p className="font-semibold">{title}</p>
      {message ? <p className="mt-1 text-ink-800">{message}</p> : null}
      {onRetry ? (
        <button type="button" onClick={onRetry} className="btn-secondary mt-3">
          Try again
        </button>
      ) : null}
    </div>
  );
}

export function ListSkeleton({ rows = 5, label = "Loading" }: { rows?: number; label?: string }) {
  return (
    <div aria-busy="true" aria-label={label} className="space-y-2">
      {Array.from({ length: rows }, (_, i) => (
        <div key={i} className="h-16 animate-pulse rounded-lg bg-ink-100" />
      ))}
    </div>
  );
}
