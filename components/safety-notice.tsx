/**
 * The caution that goes on every screen: Flueward reports checks against the company's tables;
 * the adopted code, the authority having jurisdiction and the manufacturer's instructions govern.
 */
export const SAFETY_NOTICE_SHORT =
  "Flueward reports checks against your company's rulebook. The locally adopted code, the authority having jurisdiction and the appliance manufacturer's installation instructions govern. Venting and combustion-air work must be done and verified by a licensed professional.";

export function SafetyNotice({ variant = "footer" }: { variant?: "footer" | "box" }) {
  if (variant === "box") {
    return (
      <aside role="note" className="rounded-lg border-l-4 border-warn bg-warn-soft px-4 py-3 text-sm text-ink-800">
        <p className="font-semibold text-warn">Caution</p>
        <p className="mt-1">{SAFETY_NOTICE_SHORT}</p>
        <p className="mt-1">
          If you smell gas, find CO or see spillage: stop, make the appliance safe, ventilate and follow your emergency procedure.
        </p>
      </aside>
    );
  }
  return <p className="text-xs leading-relaxed text-ink-500">{SAFETY_NOTICE_SHORT}</p>;
}
