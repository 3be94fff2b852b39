import { requirePagePermission } from "@/lib/auth/session";
import { getRulebook, listRulebooks } from "@/lib/data/rulebooks";
import example from "@/docs/examples/check-request.json";
import { CheckSandbox } from "./check-sandbox";

export const metadata = { title: "Try a check" };

export default async function CheckPage() {
  const member = await requirePagePermission("rulebooks.read");
  const rulebooks = await listRulebooks({ companyId: member.companyId });
  const options = (
    await Promise.all(rulebooks.map((rb) => getRulebook({ companyId: member.companyId, id: rb.id })))
  ).flatMap((rb) => rb.versions.map((v) => ({ versionId: v.id, label: `${rb.name} — version ${v.versionNumber}${rb.isDefault && v.versionNumber === rb.latestVersionNumber ? " (current)" : ""}`, current: rb.isDefault && v.versionNumber === rb.latestVersionNumber })));
  const { rulebookVersionId: _placeholder, ...exampleInput } = example as Record<string, unknown>;
  return (
    <div className="space-y-4">
      <div>
        <h1 className="text-2xl font-bold tracking-tight">Try a check</h1>
        <p className="max-w-3xl text-sm text-ink-600">
          Runs the engine on a vent run, air space and readings written as JSON — the same request an integration sends to <code className="font-mono">POST /api/check</code> (see docs/engine.md). The example is a demo scenario; inspections are entered from a job.
        </p>
      </div>
      <CheckSandbox versions={options} example={JSON.stringify(exampleInput, null, 2)} />
    </div>
  );
}
