/** Flueward's mark: a vent rising from a housing, in our own colours. */
export function BrandMark({ className = "h-8 w-8" }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true">
      <rect width="32" height="32" rx="7" fill="#283239" />
      <path d="M11 26V14l5-4 5 4v12" fill="none" stroke="#f1c9a8" strokeWidth="2.4" strokeLinejoin="round" />
      <path d="M16 10V5" stroke="#d97f47" strokeWidth="2.4" strokeLinecap="round" />
      <path d="M13 20h6" stroke="#f1c9a8" strokeWidth="2" strokeLinecap="round" />
    </svg>
  );
}
