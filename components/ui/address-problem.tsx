/** Says that a list's address could not be read, and which list is shown instead. */
export function AddressProblem({ problem, shown }: { problem: string | null; shown: string }) {
  if (!problem) return null;
  return (
    <p role="status" className="rounded-lg border border-warn/30 bg-warn-soft px-3 py-2 text-sm text-ink-800">
      Some filters in this address could not be read, so {shown} shown. {problem}
    </p>
  );
}
