import { requirePagePermission } from "@/lib/auth/session";
import { listSiteCheckItems } from "@/lib/data/site-checks";
import { SiteChecksManager } from "./site-checks-manager";

export const metadata = { title: "Site checks" };

export default async function SiteChecksPage() {
  const member = await requirePagePermission("site_checks.manage");
  const items = await listSiteCheckItems({ companyId: member.companyId, includeInactive: true });
  return (
    <div className="space-y-4">
      <div>
        <h1 className="text-2xl font-bold tracking-tight">Site checks</h1>
        <p className="max-w-2xl text-sm text-ink-600">
          The yes / no / not-applicable items installers at {member.companyName} confirm before leaving a job. Installers see the active items that apply to the
          job&apos;s appliances, in this order. Items are never deleted: deactivate one to take it off the list, so earlier answers keep pointing at it.
        </p>
      </div>
      <SiteChecksManager initialItems={items} />
    </div>
  );
}
