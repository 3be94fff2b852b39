import { ListSkeleton } from "@/components/ui/states";

export default function Loading() {
  return (
    <div className="space-y-4">
      <div className="h-8 w-48 animate-pulse rounded bg-ink-100" />
      <ListSkeleton rows={4} label="Loading page" />
    </div>
  );
}
