import { requirePagePermission } from "@/lib/auth/session";
import { ReviewQueue } from "./review-queue";

export const metadata = { title: "Review queue" };

export default async function ReviewPage() {
  await requirePagePermission("inspections.review");
  return (
    <div className="space-y-4">
      <div>
        <h1 className="text-2xl font-bold tracking-tight">Review queue</h1>
        <p className="text-sm text-ink-600">Submitted inspections, oldest first. Open one to return it with comments or approve and sign it.</p>
      </div>
      <ReviewQueue />
    </div>
  );
}
