import { z } from "zod";
import { apiRoute, parseParams } from "@/lib/api/handler";
import { requirePermission } from "@/lib/auth/session";
import { getRulebookVersion } from "@/lib/data/rulebooks";
import { idSchema } from "@/lib/schemas/common";
import { RULEBOOK_TABLE_KEYS } from "@/lib/venting";
import { csvFileName, tableToCsv } from "@/lib/rulebooks/csv";

const paramsSchema = z.object({ id: idSchema, version: idSchema, table: z.enum(RULEBOOK_TABLE_KEYS) });

/** One table of one version as a CSV download. */
export const GET = apiRoute<{ id: string; version: string; table: string }>(async (_request, context) => {
  const member = await requirePermission("rulebooks.read");
  const { id, version, table } = await parseParams(context, paramsSchema);
  const found = await getRulebookVersion({ companyId: member.companyId, rulebookId: id, versionNumber: version });
  const csv = tableToCsv(table, found.content[table] as never);
  return new Response(csv, {
    headers: {
      "Content-Type": "text/csv; charset=utf-8",
      "Content-Disposition": `attachment; filename="v${version}-${csvFileName(table)}"`,
      "Cache-Control": "no-store",
    },
  });
});
