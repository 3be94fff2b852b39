/** The fields of an appliance that decide whether a vent run serves it. */
interface ApplianceLike {
  readonly id?: string | null;
  readonly draft?: string | null;
}

/** The fields of a vent run that name the appliances it serves. */
interface RunLike {
  readonly applianceIds?: readonly (string | null | undefined)[] | null;
  readonly segments?: readonly ({ readonly applianceId?: string | null } | null | undefined)[] | null;
}

/**
 * Ids of the appliances a vent run serves, as the engine reads the run: `applianceIds` when
 * given, else every appliance that is not direct-vent; then any appliance a segment names. Only
 * ids of appliances that exist are returned, each once, in that order. Appliances without an id
 * are known as `appliance-<n>` (1-based), as the drawing names them.
 */
export function servedApplianceIds(run: RunLike | null | undefined, appliances: readonly (ApplianceLike | null | undefined)[]): string[] {
  const ids = appliances.map((a, i) => (typeof a?.id === "string" && a.id ? a.id : `appliance-${i + 1}`));
  const listed = Array.isArray(run?.applianceIds) ? run.applianceIds : ids.filter((_, i) => appliances[i]?.draft !== "direct_vent");
  const named = Array.isArray(run?.segments) ? run.segments.map((s) => s?.applianceId) : [];
  const out: string[] = [];
  for (const id of [...listed, ...named]) if (typeof id === "string" && ids.includes(id) && !out.includes(id)) out.push(id);
  return out;
}
