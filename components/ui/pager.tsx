"use client";

/** Page count and Previous/Next buttons under a paginated list. */
export function Pager({ total, page, pageCount, noun, onPage }: { total: number; page: number; pageCount: number; noun: string; onPage: (page: number) => void }) {
  return (
    <nav aria-label="Pages" className="flex items-center justify-between gap-2 text-sm">
      <p className="text-ink-600" aria-live="polite">
        {total} {noun}
        {total === 1 ? "" : "s"} · page {page} of {pageCount}
      </p>
      <div className="flex gap-2">
        <button type="button" className="btn-secondary" disabled={page <= 1} onClick={() => onPage(Math.max(1, page - 1))}>
          Previous
        </button>
        <button type="button" className="btn-secondary" disabled={page >= pageCount} onClick={() => onPage(Math.min(pageCount, page + 1))}>
          Next
        </button>
      </div>
    </nav>
  );
}
