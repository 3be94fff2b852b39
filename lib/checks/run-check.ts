import "server-only";
import { z } from "zod";
import { checkInputSchema, evaluateInspection, prepareRulebook, type PreparedRulebook } from "@/lib/venting";
import { AppError } from "@/lib/errors";
import { getRulebookVersionContent, getRulebookVersionRef, type RulebookVersion, type RulebookVersionRef } from "@/lib/data/rulebooks";
import { idSchema } from "@/lib/schemas/common";

/** POST /api/check: the engine's input plus the rulebook version to check against (the current one when omitted). */
export const checkRequestSchema = checkInputSchema.extend({ rulebookVersionId: idSchema.optional() });
export type CheckRequest = z.infer<typeof checkRequestSchema>;

/** Prepared rulebooks by version id: versions never change, so a prepared one stays valid. */
const prepared = new Map<number, PreparedRulebook>();
const MAX_PREPARED = 50;

export function preparedFor(version: Pick<RulebookVersion, "id" | "content">): PreparedRulebook {
  let rulebook = prepared.get(version.id);
  if (!rulebook) {
    rulebook = prepareRulebook(version.content);
    if (prepared.size >= MAX_PREPARED) prepared.delete(prepared.keys().next().value as number);
    prepared.set(version.id, rulebook);
  }
  return rulebook;
}

/**
 * The prepared form of one of the company's versions, read and prepared only the first time: the
 * version's content is parsed (64 KB for the starter rulebook) only when it is not cached.
 */
export async function preparedForRef(companyId: number, ref: RulebookVersionRef): Promise<PreparedRulebook> {
  const cached = prepared.get(ref.id);
  if (cached) return cached;
  const content = await getRulebookVersionContent({ companyId, versionId: ref.id });
  return preparedFor({ id: ref.id, content });
}

export async function runCheck(args: { companyId: number; request: CheckRequest }) {
  const { rulebookVersionId, ...input } = args.request;
  const version = await getRulebookVersionRef({ companyId: args.companyId, versionId: rulebookVersionId });
  if (!version) throw new AppError("unprocessable", "Your company has no current rulebook. Ask a supervisor to create one.");
  const result = evaluateInspection(input, await preparedForRef(args.companyId, version));
  const label = `${version.rulebookName}, version ${version.versionNumber}`;
  return {
    rulebook: { rulebookId: version.rulebookId, name: version.rulebookName, versionId: version.id, versionNumber: version.versionNumber, contentSha256: version.contentSha256 },
    summary: result.summary,
    findings: result.findings.map((finding) => ({ ...finding, rulebookVersion: label })),
    sizing: result.sizing,
  };
}
