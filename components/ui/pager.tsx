import Link from "next/link";

/**
 * Page count and Previous/Next links under a paginated list. Links, not buttons: each page has
 * its own address, so the back button, a reload or a shared link shows the same page.
 */
export function Pager({ total, page, pageCount, noun, hrefFor }: { total: number; page: number; pageCount: number; noun: string; hrefFor: (page: number) => string }) {
  const step = (target: number, label: string, enabled: boolean) =>
    enabled ? (
      <Link href={hrefFor(target)} className="btn-secondary" scroll={false}>
        {label}
      </Link>
    ) : (
      <span className="btn-secondary pointer-events-none opacity-50" aria-disabled="true">
        {label}
      </span>
    );
  return (
    <nav aria-label="Pages" className="flex items-center justify-between gap-2 text-sm">
      <p className="text-ink-600" aria-live="polite">
        {total} {noun}
        {total === 1 ? "" : "s"} · page {page} of {pageCount}
      </p>
      <div className="flex gap-2">
        {step(Math.max(1, page - 1), "Previous", page > 1)}
        {step(Math.min(pageCount, page + 1), "Next", page < pageCount)}
      </div>
    </nav>
  );
}
